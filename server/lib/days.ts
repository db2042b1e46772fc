// Calendar days as the API and the database's DATE columns write them: YYYY-MM-DD, in UTC.

export function isoDay(d: Date): string {
  return d.toISOString().slice(0, 10);
}
