/** A laboratory's admin sets what it offers and at what price per lot; empty means not offered. */
import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useOrganisation } from "../../lib/signed-in.tsx";
import { priceListQuery, useSavePriceList } from "./api/audits.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { Button } from "../../components/ui/button.tsx";
import { Notice, QueryStatus } from "../../components/ui/states.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { parseMoney } from "../../../shared/audits/vocabulary.ts";
import { priceListSchema } from "../../../shared/audits/schemas.ts";
import { PARAMETERS } from "../../../shared/engine/index.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const MEASURED = PARAMETERS.filter((p) => !("derivedFrom" in p && p.derivedFrom));

export function PriceListPage() {
  const { orgId } = useOrganisation();
  const list = useQuery({ ...priceListQuery(orgId) });
  return (
    <>
      <PageHeader
        title="Price list"
        lead="What your laboratory analyses for buyers' audits, and the price per lot in euro. Orders keep the price they were placed at."
      />
      <QueryStatus query={list} />
      {list.data && <PriceListEditor orgId={orgId} items={list.data.items} />}
    </>
  );
}

function PriceListEditor({ orgId, items: saved }: { orgId: number; items: { parameter: string; priceCents: number }[] }) {
  const save = useSavePriceList(orgId);
  const [texts, setTexts] = useState<Record<string, string>>(() =>
    Object.fromEntries(saved.map((i) => [i.parameter, (i.priceCents / 100).toFixed(2)])),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});

  const onSave = () => {
    const bad: Record<string, string> = {};
    const items = MEASURED.flatMap((p) => {
      const text = texts[p.id]?.trim() ?? "";
      if (!text) return [];
      const cents = parseMoney(text);
      if (cents === null) bad[p.id] = "Use a price like 14.50.";
      return cents === null ? [] : [{ parameter: p.id, priceCents: cents }];
    });
    const parsed = priceListSchema.safeParse({ items });
    if (!parsed.success) for (const i of parsed.error.issues) bad[items[Number(i.path[1])]?.parameter ?? "_"] = i.message;
    setErrors(bad);
    if (Object.keys(bad).length === 0 && parsed.success) save.mutate(parsed.data);
  };

  return (
    <Card>
      <DataTable headings={["Parameter", "Group", "Price per lot (EUR)"]}>
        {MEASURED.map((p) => (
          <Row key={p.id}>
            <th scope="row" className="py-1 pr-3 font-normal">
              {p.name}
            </th>
            <Cell dense className="text-ink-500">
              {p.group}
            </Cell>
            <Cell dense>
              <input
                aria-label={`Price of ${p.name}`}
                aria-invalid={errors[p.id] ? true : undefined}
                inputMode="decimal"
                placeholder="not offered"
                className="w-32 rounded-md border border-line px-2 py-1 aria-[invalid=true]:border-alarm-700"
                value={texts[p.id] ?? ""}
                onChange={(e) => setTexts({ ...texts, [p.id]: e.target.value })}
              />
              {errors[p.id] && (
                <span role="alert" className="ml-2 text-xs font-semibold text-alarm-700">
                  {errors[p.id]}
                </span>
              )}
            </Cell>
          </Row>
        ))}
      </DataTable>
      <div className="mt-4 flex items-center gap-3">
        <Button onClick={onSave} disabled={save.isPending}>
          Save the price list
        </Button>
        {save.isSuccess && <span className="text-sm text-verjus-700">Saved.</span>}
      </div>
      {save.isError && <Notice tone="error">{errorMessage(save.error)}</Notice>}
    </Card>
  );
}
