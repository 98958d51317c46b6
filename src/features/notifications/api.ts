import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../lib/api-client.ts";
import type { NotificationKind } from "../../../shared/deviations/vocabulary.ts";

export interface NotificationItem {
  id: number;
  kind: string;
  title: string;
  body: string;
  link: string;
  read: boolean;
  createdAt: string;
}

export const notificationsQuery = () =>
  queryOptions({ queryKey: ["notifications"], queryFn: () => api<{ unread: number; items: NotificationItem[] }>("/api/me/notifications"), refetchInterval: 60_000 });

export const preferencesQuery = () =>
  queryOptions({ queryKey: ["notifications", "preferences"], queryFn: () => api<{ emailMode: "immediate" | "daily_digest" | "off"; kinds: NotificationKind[] }>("/api/me/notification-preferences") });

export function useMarkRead() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (ids: number[] | "all") => api<void>("/api/me/notifications/read", { method: "POST", body: { ids } }), onSuccess: () => qc.invalidateQueries({ queryKey: ["notifications"] }) });
}

export function useSavePreferences() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (p: { emailMode: "immediate" | "daily_digest" | "off"; kinds: NotificationKind[] }) => api("/api/me/notification-preferences", { method: "PUT", body: p }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ["notifications", "preferences"] }),
  });
}
