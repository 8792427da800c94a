/** One mail the local mail stand-in captured, as GET /api/dev/mail lists it (never served in production). */
export interface CapturedMailDto {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** ISO 8601, when the stand-in received it. */
  date: string;
}
