import { Injectable, Logger } from '@nestjs/common';
import { diagnose, type Diagnosis, type WrittenSteps } from '@workback/core';

export type Checked =
  | { checked: true; diagnosis: Diagnosis }
  | { checked: false; part: 'problem' | 'answer' | 'steps'; reason: string };

/** Runs the core engine for the API; an engine failure is "not checked", never a failed save. */
@Injectable()
export class DiagnoseService {
  private readonly logger = new Logger(DiagnoseService.name);

  check(problem: string, answer: string, steps?: WrittenSteps | null): Checked {
    try {
      const result = diagnose(problem, answer, steps ? { steps } : {});
      if (result.ok) return { checked: true, diagnosis: result };
      return { checked: false, part: result.part, reason: result.error.message };
    } catch (err) {
      // An engine gap (an operation not worked yet) must not lose the parent's entry.
      this.logger.warn(`diagnose threw: ${err instanceof Error ? err.message : String(err)}`);
      return {
        checked: false,
        part: 'problem',
        reason: 'The checkers cannot work this kind of problem yet.',
      };
    }
  }
}
