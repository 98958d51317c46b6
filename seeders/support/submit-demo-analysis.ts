/**
 * Demo analyses go in the way a producer's quality staff send them: through submitAnalysis, so the
 * engine judges them, deviations open with their trail entries, and both parties are notified.
 */
import type { QueryInterface } from "sequelize";
import { Lot } from "../../server/models/lot.ts";
import { submitAnalysis } from "../../server/services/lots/submission-service.ts";
import { demoMember, useDemoServices } from "./demo-services.ts";
import type { AnalysisStage } from "../../shared/lots/vocabulary.ts";
import { analysisSubmissionSchema } from "../../shared/lots/schemas.ts";

export interface DemoAnalysis {
  lotCode: string;
  contractId: number;
  /** The producer's quality member who sends it. */
  by: string;
  stage: AnalysisStage;
  lab: string;
  accreditation: string | null;
  sampleDate: string;
  results: [parameter: string, raw: string, unit: string][];
}

export async function submitDemoAnalyses(qi: QueryInterface, analyses: DemoAnalysis[]): Promise<void> {
  useDemoServices(qi);
  for (const a of analyses) {
    const { user, orgId } = await demoMember(a.by, "producer_quality");
    const lot = (await Lot.findOne({ where: { contractId: a.contractId, lotCode: a.lotCode } }))!;
    await submitAnalysis(
      orgId,
      lot.id,
      user,
      analysisSubmissionSchema.parse({
        idempotencyKey: `demo-${a.contractId}-${a.lotCode}-${a.stage}-${a.sampleDate}`,
        stage: a.stage,
        laboratoryName: a.lab,
        accreditation: a.accreditation,
        sampleDate: a.sampleDate,
        results: a.results.map(([parameter, raw, unit]) => ({ parameter, raw, unit, uncertainty: null, method: null })),
      }),
    );
  }
}
