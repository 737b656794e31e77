// A night named by the dates it spans, as an ISO 8601 time interval of two calendar dates whose end
// leaves out the parts it shares with the start (ISO 8601:2004, 4.4.5): 2027-03-03/04,
// 2027-03-31/04-01, 2027-12-31/2028-01-01. The start is the local date of the evening.
import { DateTime } from 'luxon';

export function nightInterval(eveningDate: string): string {
  const morning = DateTime.fromISO(eveningDate, { zone: 'utc' }).plus({ days: 1 }).toISODate()!;
  if (morning.slice(0, 4) !== eveningDate.slice(0, 4)) return `${eveningDate}/${morning}`;
  if (morning.slice(5, 7) !== eveningDate.slice(5, 7)) return `${eveningDate}/${morning.slice(5)}`;
  return `${eveningDate}/${morning.slice(8)}`;
}
