/** The signed-in user's notification preferences. */
import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import type { NotificationKind } from "../../../../shared/deviations/vocabulary.ts";

export const preferenceKeys = { mine: ["me", "notification-preferences"] as const };

export const preferencesQuery = () =>
  queryOptions({
    queryKey: preferenceKeys.mine,
    queryFn: () => api<{ emailMode: "immediate" | "daily_digest" | "off"; kinds: NotificationKind[] }>("/api/me/notification-preferences"),
  });

export function useSavePreferences() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (p: { emailMode: "immediate" | "daily_digest" | "off"; kinds: NotificationKind[] }) =>
      api("/api/me/notification-preferences", { method: "PUT", body: p }),
    onSuccess: () => qc.invalidateQueries({ queryKey: preferenceKeys.mine }),
  });
}
