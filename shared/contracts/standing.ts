/** POST /api/standing-orders/materialise: what making the standing orders now did (server/orders/standing.service.ts). */
export interface MaterialiseResult {
  created: number;
  updated: number;
  cancelled: number;
}
