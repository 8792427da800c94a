import { Matches } from 'class-validator';

const isoDay = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

/** A range of whole days, both ends included (the service checks order and length). */
export class DashboardQueryDto {
  @Matches(isoDay, { message: 'The start day is a date like 2026-01-31.' })
  from!: string;

  @Matches(isoDay, { message: 'The end day is a date like 2026-01-31.' })
  to!: string;
}
