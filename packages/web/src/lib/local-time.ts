/** The local clock time now, as `YYYY-MM-DDTHH:mm` (what a datetime-local field holds). */
export function localNow(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}T${pad(now.getHours())}:${pad(now.getMinutes())}`;
}
