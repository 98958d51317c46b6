import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { notificationsKey } from "../../lib/refresh.ts";
import { api } from "../../lib/api-client.ts";

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
  queryOptions({
    queryKey: notificationsKey,
    queryFn: () => api<{ unread: number; items: NotificationItem[] }>("/api/me/notifications"),
    refetchInterval: 60_000,
  });

export function useMarkRead() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (ids: number[] | "all") => api<void>("/api/me/notifications/read", { method: "POST", body: { ids } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: notificationsKey }),
  });
}
