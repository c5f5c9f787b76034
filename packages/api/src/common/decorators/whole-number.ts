/** Plain decimal digits only: `0x13`, `1e1`, `19.0`, `+19` and ` 19` are not numbers here. */
export const WHOLE_NUMBER_TEXT = /^(0|[1-9][0-9]{0,14})$/;
