import type { RuleCount } from '@workback/core';
import { Link, useNavigate } from 'react-router-dom';
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

import { notebookHref } from '../notebook-link';
import { shortDay } from '../types';

const TOP = 6;

/** The error rules seen most often, as bars; each leads to the Notebook filtered to that rule. */
export function TopRulesChart({
  rules,
  studentId,
  from,
  to,
}: {
  rules: readonly RuleCount[];
  studentId: number;
  from: string | null;
  to: string | null;
}) {
  const navigate = useNavigate();
  const top = rules.slice(0, TOP);
  const data = top.map((r) => ({ title: r.title, count: r.count }));
  return (
    <figure className="wb-chart">
      <figcaption className="wb-muted">The error rules seen most often</figcaption>
      <div aria-hidden className="wb-chart-canvas">
        <ResponsiveContainer width="100%" height={Math.max(120, top.length * 44 + 30)}>
          <BarChart
            data={data}
            layout="vertical"
            margin={{ top: 4, right: 16, bottom: 4, left: 8 }}
            accessibilityLayer={false}
          >
            <CartesianGrid stroke="#e4ddcb" horizontal={false} />
            <XAxis type="number" allowDecimals={false} tick={{ fill: '#4a5a73', fontSize: 12 }} />
            <YAxis
              type="category"
              dataKey="title"
              width={150}
              tick={{ fill: '#1f2f4a', fontSize: 12 }}
            />
            <Tooltip cursor={{ fill: 'rgba(31, 47, 74, 0.06)' }} />
            <Bar
              dataKey="count"
              name="Misses"
              fill="#1c6e62"
              cursor="pointer"
              barSize={22}
              onClick={(_bar, index) => {
                const rule = top[index];
                if (rule) void navigate(notebookHref({ studentId, rule: rule.ruleId, from, to }));
              }}
            />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <ul className="wb-rule-counts" aria-label="Error rules by how often they were seen">
        {rules.map((r) => (
          <li key={r.ruleId}>
            <span>{r.title}</span>{' '}
            <Link to={notebookHref({ studentId, rule: r.ruleId, from, to })}>
              {r.count === 1 ? '1 miss' : `${r.count} misses`}
            </Link>{' '}
            <span className="wb-muted">
              {shortDay(r.firstSeen)} – {shortDay(r.lastSeen)}
            </span>
          </li>
        ))}
      </ul>
    </figure>
  );
}
