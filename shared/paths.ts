/**
 * The client's addresses for the things a notification or an e-mail points at. The router mounts
 * its pages on these patterns and the server builds its links with these functions, so a link
 * can never point at a page that does not exist.
 */
export const ROUTES = {
  order: "/audits/:orderId",
  deviation: "/deviations/:deviationId",
  lot: "/lots/:lotId",
  spec: "/specs/:specId",
  contract: "/contracts/:contractId",
} as const;

export const orderPath = (id: number) => `/audits/${id}`;
export const deviationPath = (id: number) => `/deviations/${id}`;
export const lotPath = (id: number) => `/lots/${id}`;
export const specPath = (id: number) => `/specs/${id}`;
export const contractPath = (id: number) => `/contracts/${id}`;
