import { CAUSE_GUIDE, CAUSES, type WeekCauseMix } from '@workback/core';
import { Link, useNavigate } from 'react-router-dom';
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';

import { notebookHref } from '../notebook-link';
import { CAUSE_COLOUR, shortDay } from '../types';

/**
 * Misses per week by cause, as stacked bars; a bar leads to that week's misses of that cause.
 * The same numbers follow in a table with links, for keyboards and screen readers.
 */
export function CauseMixChart({
  weeks,
  studentId,
}: {
  weeks: readonly WeekCauseMix[];
  studentId: number;
}) {
  const navigate = useNavigate();
  const used = CAUSES.filter((cause) => weeks.some((w) => w.causes[cause] > 0));
  const data = weeks.map((w) => ({ label: shortDay(w.from), ...w.causes }));
  return (
    <figure className="wb-chart">
      <figcaption className="wb-muted">
        Misses per week, by cause (weeks start on Monday)
      </figcaption>
      <div aria-hidden className="wb-chart-canvas">
        <ResponsiveContainer width="100%" height={260}>
          <BarChart
            data={data}
            margin={{ top: 8, right: 8, bottom: 0, left: -20 }}
            accessibilityLayer={false}
          >
            <CartesianGrid stroke="#e4ddcb" vertical={false} />
            <XAxis dataKey="label" tick={{ fill: '#4a5a73', fontSize: 12 }} />
            <YAxis allowDecimals={false} tick={{ fill: '#4a5a73', fontSize: 12 }} />
            <Tooltip cursor={{ fill: 'rgba(31, 47, 74, 0.06)' }} />
            <Legend wrapperStyle={{ fontSize: 13 }} />
            {used.map((cause) => (
              <Bar
                key={cause}
                dataKey={cause}
                name={CAUSE_GUIDE[cause].label}
                stackId="causes"
                fill={CAUSE_COLOUR[cause]}
                cursor="pointer"
                onClick={(_bar, index) => {
                  const week = weeks[index];
                  if (week)
                    void navigate(notebookHref({ studentId, cause, from: week.from, to: week.to }));
                }}
              />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </div>
      <details className="wb-details">
        <summary>The numbers, week by week</summary>
        <div className="wb-table-scroll">
          <table className="wb-numbers">
            <thead>
              <tr>
                <th scope="col">Week of</th>
                {used.map((cause) => (
                  <th key={cause} scope="col">
                    {CAUSE_GUIDE[cause].label}
                  </th>
                ))}
                <th scope="col">All</th>
              </tr>
            </thead>
            <tbody>
              {weeks.map((w) => (
                <tr key={w.week}>
                  <th scope="row">{shortDay(w.from)}</th>
                  {used.map((cause) => (
                    <td key={cause}>
                      {w.causes[cause] > 0 ? (
                        <Link
                          to={notebookHref({ studentId, cause, from: w.from, to: w.to })}
                          aria-label={`${w.causes[cause]} ${CAUSE_GUIDE[cause].label} in the week of ${shortDay(w.from)}`}
                        >
                          {w.causes[cause]}
                        </Link>
                      ) : (
                        0
                      )}
                    </td>
                  ))}
                  <td>
                    {w.total > 0 ? (
                      <Link to={notebookHref({ studentId, from: w.from, to: w.to })}>
                        {w.total}
                      </Link>
                    ) : (
                      0
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
