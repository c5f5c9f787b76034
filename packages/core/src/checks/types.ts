/** The digit-sum working for one number: `347` → `{ number: '347', working: ['3 + 4 + 7 = 14', '1 + 4 = 5'], residue: 5 }`. */
export interface ResidueWorking {
  readonly number: string;
  readonly working: readonly string[];
  readonly residue: number;
}

/** The outcome of casting out nines or elevens. */
export type CheckResult =
  | {
      readonly applies: true;
      readonly method: 'nines' | 'elevens';
      readonly passes: boolean;
      readonly numbers: readonly ResidueWorking[];
      /** The problem's side worked with the residues, e.g. `'5 + 4 = 9 → 0'`. */
      readonly problemSide: { readonly working: string; readonly residue: number };
      /** The answer's side, e.g. `'936 → 0'`. */
      readonly answerSide: { readonly working: string; readonly residue: number };
      readonly verdict: string;
      readonly caveat: string;
      readonly warnings: readonly string[];
    }
  | {
      readonly applies: false;
      readonly method: 'nines' | 'elevens';
      readonly passes: null;
      readonly reason: string;
    };
