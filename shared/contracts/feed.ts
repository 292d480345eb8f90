/** An account's private calendar address (GET/POST /api/calendar-feed): server/orders/feed.service.ts. */
export interface CalendarFeedDto {
  /** The .ics address; null when the account has none (GET only: POST always makes one). */
  url: string | null;
}
