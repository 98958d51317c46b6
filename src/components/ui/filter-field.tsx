/** A typed list filter: it shows what the user types at once and hands it on once typing pauses, so a list is asked once per pause. */
import { TextField, type TextFieldProps } from "./field.tsx";
import { useDebouncedCallback } from "../../lib/use-debounced.ts";

type Props = Omit<TextFieldProps, "onChange" | "defaultValue" | "value"> & { value?: string; onFilter: (value: string) => void };

export function FilterField({ value, onFilter, type = "search", ...props }: Props) {
  const handOn = useDebouncedCallback(onFilter);
  return <TextField type={type} defaultValue={value ?? ""} onChange={(e) => handOn(e.target.value)} {...props} />;
}
