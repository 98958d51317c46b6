import { useInfiniteQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { notificationPagesQuery, useMarkRead } from "./api.ts";
import { rowsOf } from "../../lib/paged.ts";
import { MoreRows } from "../../components/ui/more-rows.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { QueryStatus } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";

export function NotificationsPage() {
  const q = useInfiniteQuery(notificationPagesQuery());
  const mark = useMarkRead();
  return (
    <>
      <PageHeader
        title="Notifications"
        lead="New deviations, comments, mentions, decisions and deadlines. Choose what reaches you by e-mail on your profile."
        actions={
          <Button variant="secondary" onClick={() => mark.mutate("all")}>
            Mark all read
          </Button>
        }
      />
      <Card>
        <QueryStatus query={q} empty="Nothing yet." />
        <ul className="flex flex-col divide-y divide-line/60">
          {rowsOf(q.data).map((n) => (
            <li key={n.id} className={`py-2 text-sm ${n.read ? "text-ink-500" : ""}`}>
              <Link to={n.link} className="font-semibold text-must-700 underline" onClick={() => !n.read && mark.mutate([n.id])}>
                {n.title}
              </Link>
              <span className="ml-2 text-xs text-ink-500">{new Date(n.createdAt).toLocaleString("en-GB")}</span>
              <p className="line-clamp-2 whitespace-pre-wrap">{n.body}</p>
            </li>
          ))}
        </ul>
        <MoreRows query={q} noun="notifications" />
      </Card>
    </>
  );
}
