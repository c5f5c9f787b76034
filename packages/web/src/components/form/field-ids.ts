/** `fieldIds('email')` → ids for the input and the line under it, so errors are announced. */
export function fieldIds(name: string, idPrefix = 'field') {
  const id = `${idPrefix}-${name}`;
  return { id, describedBy: `${id}-help` };
}
