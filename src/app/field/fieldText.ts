/** Metres as the field view shows them: whole metres below 10 km, km with two decimals beyond. */
export function fieldDistanceText(m: number): string {
  return m < 10_000 ? `${Math.round(m).toLocaleString('en')} m` : `${(m / 1000).toFixed(2)} km`;
}

/** Degrees to one decimal, with the degree sign. */
export function fieldDegText(deg: number): string {
  return `${deg.toFixed(1)}°`;
}

/** A local clock time "09:41" for a visit recorded today, else the date and time. */
export function fieldWhenText(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const time = d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  return d.toDateString() === new Date().toDateString() ? time : `${d.toLocaleDateString('en-CA')} ${time}`;
}
