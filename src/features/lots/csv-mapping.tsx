/** The column-mapping step of the CSV import: what each column of the file means. */
import { PARAMETERS, UNITS, findParameter, type UnitId } from "../../../shared/engine/index.ts";
import { parseHeader, statedUnit, type ColumnRole } from "../../../shared/lots/csv.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const ROLE_OPTIONS: { value: string; label: string }[] = [
  { value: "ignore", label: "Ignore this column" },
  { value: "lot", label: "Lot code" },
  { value: "vintage", label: "Vintage" },
  { value: "date", label: "Sample date" },
  { value: "parameter-name", label: "Parameter name (one result per row)" },
  { value: "value", label: "Result value (one result per row)" },
  { value: "unit", label: "Unit (one result per row)" },
  { value: "uncertainty", label: "Uncertainty U (one result per row)" },
  { value: "method", label: "Method (one result per row)" },
  ...PARAMETERS.map((p) => ({ value: `parameter:${p.id}`, label: `Result: ${p.name}` })),
];

const roleValue = (r: ColumnRole) => (r.kind === "parameter" ? `parameter:${r.parameter}` : r.kind);

/** A column newly mapped to a parameter keeps the unit its header states; with none, the user is asked. */
function roleFrom(value: string, header: string): ColumnRole {
  if (value.startsWith("parameter:")) {
    const p = findParameter(value.slice("parameter:".length))!;
    const said = parseHeader(header);
    return { kind: "parameter", parameter: p.id, unit: statedUnit(p.id, said.unit), headerUnit: said.unitText };
  }
  return { kind: value } as ColumnRole;
}

export function CsvMapping({
  headers,
  sample,
  mapping,
  onChange,
}: {
  headers: string[];
  sample: string[][];
  mapping: ColumnRole[];
  onChange: (m: ColumnRole[]) => void;
}) {
  const set = (i: number, role: ColumnRole) => onChange(mapping.map((m, j) => (j === i ? role : m)));
  return (
    <DataTable headings={["Column in the file", "First values", "Means", "Unit"]}>
      {headers.map((h, i) => {
        const role = mapping[i] ?? { kind: "ignore" };
        const p = role.kind === "parameter" ? findParameter(role.parameter) : undefined;
        return (
          <Row key={`${h}-${i}`}>
            <Cell className="font-semibold">{h || `(column ${i + 1})`}</Cell>
            <Cell className="text-ink-500">
              {sample
                .slice(0, 3)
                .map((r) => r[i])
                .filter(Boolean)
                .join(" · ")}
            </Cell>
            <Cell>
              <label className="sr-only" htmlFor={`map-${i}`}>
                Meaning of column {h}
              </label>
              <select
                id={`map-${i}`}
                className="w-72 rounded border border-line px-2 py-1"
                value={roleValue(role)}
                onChange={(e) => set(i, roleFrom(e.target.value, h))}
              >
                {ROLE_OPTIONS.map((o) => (
                  <option key={o.value} value={o.value}>
                    {o.label}
                  </option>
                ))}
              </select>
            </Cell>
            <Cell>
              {role.kind === "parameter" && p && (
                <>
                  <label className="sr-only" htmlFor={`unit-${i}`}>
                    Unit of column {h}
                  </label>
                  <select
                    id={`unit-${i}`}
                    className="rounded border border-line px-2 py-1"
                    value={role.unit ?? ""}
                    aria-invalid={role.unit === null ? true : undefined}
                    onChange={(e) => set(i, { ...role, unit: (e.target.value || null) as UnitId | null })}
                  >
                    {role.unit === null && <option value="">Choose the unit…</option>}
                    {p.units.map((u) => (
                      <option key={u} value={u}>
                        {UNITS[u as UnitId].label}
                      </option>
                    ))}
                  </select>
                  {role.unit === null && (
                    <span role="alert" className="block text-xs font-semibold text-alarm-700">
                      {role.headerUnit
                        ? `"${role.headerUnit}" is not a unit for ${p.name}; choose one.`
                        : "The header does not say; choose the unit."}
                    </span>
                  )}
                </>
              )}
            </Cell>
          </Row>
        );
      })}
    </DataTable>
  );
}
