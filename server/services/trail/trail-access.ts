/** Whether an organisation may read the history of an entity: it must be a party to it. */
import { notFound } from "../../errors.ts";
import { versionFor, contractFor } from "../specs/spec-access.ts";
import { lotFor } from "../lots/lot-access.ts";
import { Deviation } from "../../models/deviation.ts";
import { entityHistory } from "./trail-service.ts";
import type { HistoryEntityType } from "../../../shared/trail/history.ts";
import { orderFor } from "../audits/order-access.ts";

export async function historyFor(orgId: number, entityType: HistoryEntityType, entityId: number) {
  switch (entityType) {
    case "spec_version":
      await versionFor(orgId, entityId);
      break;
    case "lot":
      await lotFor(orgId, entityId);
      break;
    case "contract":
      await contractFor(orgId, entityId);
      break;
    case "audit_order": {
      // An order's trail holds its payments: the buyer's business only.
      const { side } = await orderFor(orgId, entityId);
      if (side !== "buyer") throw notFound("The audit order");
      break;
    }
    case "deviation": {
      const d = await Deviation.findByPk(entityId);
      if (!d) throw notFound("The deviation");
      await contractFor(orgId, d.contractId).catch(() => {
        throw notFound("The deviation");
      });
      break;
    }
  }
  return entityHistory(entityType, String(entityId));
}
