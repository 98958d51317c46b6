import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { preferencesQuery, useSavePreferences } from "./api/preferences.ts";
import { Card } from "../../components/ui/page.tsx";
import { LoadingState, Notice } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { NOTIFICATION_KINDS, NOTIFICATION_KIND_LABELS, type NotificationKind } from "../../../shared/deviations/vocabulary.ts";

export function PreferencesCard() {
  const q = useQuery(preferencesQuery());
  return <Card title="E-mail notifications">{q.data ? <PreferencesForm initial={q.data} /> : <LoadingState />}</Card>;
}

function PreferencesForm({ initial }: { initial: { emailMode: "immediate" | "daily_digest" | "off"; kinds: NotificationKind[] } }) {
  const save = useSavePreferences();
  const [mode, setMode] = useState(initial.emailMode);
  const [kinds, setKinds] = useState<NotificationKind[]>(initial.kinds);
  return (
    <form
      className="flex flex-col gap-3 text-sm"
      onSubmit={(e) => {
        e.preventDefault();
        save.mutate({ emailMode: mode, kinds });
      }}
    >
      {save.isSuccess && <Notice tone="success">Saved.</Notice>}
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">Send e-mail</legend>
        {(
          [
            ["immediate", "As it happens"],
            ["daily_digest", "One daily digest"],
            ["off", "Never (in the app only)"],
          ] as const
        ).map(([v, label]) => (
          <label key={v} className="flex items-center gap-2">
            <input type="radio" name="email-mode" value={v} checked={mode === v} onChange={() => setMode(v)} /> {label}
          </label>
        ))}
      </fieldset>
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">For</legend>
        {NOTIFICATION_KINDS.map((k) => (
          <label key={k} className="flex items-center gap-2">
            <input
              type="checkbox"
              checked={kinds.includes(k)}
              onChange={(e) => setKinds(e.target.checked ? [...kinds, k] : kinds.filter((x) => x !== k))}
            />{" "}
            {NOTIFICATION_KIND_LABELS[k]}
          </label>
        ))}
      </fieldset>
      <Button type="submit" className="self-start" disabled={save.isPending}>
        Save preferences
      </Button>
    </form>
  );
}
