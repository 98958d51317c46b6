import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router-dom";
import { notificationsQuery } from "./api.ts";

export function NotificationBell() {
  const q = useQuery(notificationsQuery());
  const unread = q.data?.unread ?? 0;
  return (
    <Link to="/notifications" className="rounded border border-white/40 px-3 py-1 text-sm font-semibold hover:bg-must-800">
      Notifications
      {unread > 0 && (
        <span className="ml-1 rounded-full bg-white px-1.5 text-xs text-must-700">
          {unread}
          <span className="sr-only"> unread</span>
        </span>
      )}
    </Link>
  );
}
