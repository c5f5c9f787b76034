/** Validates a "minutes taken" field: empty, or whole minutes from 1 to 600. */
export const validMinutes = (value: string): true | string =>
  value.trim() === '' ||
  (/^\d{1,3}$/.test(value.trim()) && Number(value) >= 1 && Number(value) <= 600) ||
  'Whole minutes, 1 to 600, or leave it empty.';
