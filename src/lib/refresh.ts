/**
 * Refreshing after a change whose effects reach past one feature (a new deviation shows on the lot,
 * the lists, the trail and the notifications). Features invalidate their own keys themselves; what
 * spans features goes through here, so no feature types another's key.
 */
import { useQueryClient } from "@tanstack/react-query";

export const organisationKey = (orgId: number) => ["orgs", orgId] as const;
/** The signed-in user's notifications (the bell and the notifications page). */
export const notificationsKey = ["notifications"] as const;

export function useRefreshOrganisation(orgId: number) {
  const qc = useQueryClient();
  return () =>
    Promise.all([qc.invalidateQueries({ queryKey: organisationKey(orgId) }), qc.invalidateQueries({ queryKey: notificationsKey })]);
}
