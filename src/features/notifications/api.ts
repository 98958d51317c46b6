import { infiniteQueryOptions, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { Page } from "../../../shared/paging.ts";
import { queryString } from "../../lib/paged.ts";
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

type NotificationPage = Page<NotificationItem> & { unread: number };

/** The newest few, for the bell's unread count. */
export const notificationsQuery = () =>
  queryOptions({
    queryKey: [...notificationsKey, "latest"],
    queryFn: () => api<NotificationPage>("/api/me/notifications?limit=10"),
    refetchInterval: 60_000,
  });

/** Every notification, a page at a time, for the notifications page. */
export const notificationPagesQuery = () =>
  infiniteQueryOptions({
    queryKey: [...notificationsKey, "pages"],
    queryFn: ({ pageParam }) => api<NotificationPage>(`/api/me/notifications${queryString({ cursor: pageParam })}`),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
  });

export function useMarkRead() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (ids: number[] | "all") => api<void>("/api/me/notifications/read", { method: "POST", body: { ids } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: notificationsKey }),
  });
}
