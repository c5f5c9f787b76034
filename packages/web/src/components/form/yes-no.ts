/** The options of a yes / no / not-noted select (a sitting's conditions). */
export const YES_NO = [
  { value: '', label: 'Not noted' },
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
];

/** `yesNo('yes')` → true, `'no'` → false, anything else (not noted) → null. */
export const yesNo = (value: string) => (value === 'yes' ? true : value === 'no' ? false : null);
