import { render, screen, within } from '@testing-library/react';
import { diagnose } from '@workback/core';
import { describe, expect, it } from 'vitest';

import { WorkingTrace } from './working-trace';

describe('the child’s written steps in the working panel', () => {
  it('draws the partial products beside the usual ones and marks the first that differs', () => {
    // Issue 11's example: 347 × 26 answered 8,922 with partials 2,082 and 6,840;
    // 347 × 6 = 2,082 and 347 × 20 = 6,940 (worked by hand).
    const d = diagnose('347 x 26', '8922', { steps: { partials: ['2082', '6840'] } });
    if (!d.ok) throw new Error('unreadable');
    render(<WorkingTrace diagnosis={d} />);
    const table = screen.getByRole('table', { name: 'The partial products the child wrote' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toHaveTextContent(/2082.*2082.*same/);
    expect(rows[1]).toHaveTextContent(/6840.*6940.*the first that differs/);
    expect(rows[1]).toHaveClass('wb-written-first');
  });
});
