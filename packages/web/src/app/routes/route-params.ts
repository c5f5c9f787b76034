/** `readId('12')` → 12; anything but a positive whole number → `null` (the page answers 404). */
export function readId(value: string | undefined): number | null {
  const id = Number(value);
  return Number.isInteger(id) && id > 0 ? id : null;
}
