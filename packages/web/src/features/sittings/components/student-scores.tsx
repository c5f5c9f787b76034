import { Callout, HTMLTable } from '@blueprintjs/core';
import { InfoSignIcon } from '@blueprintjs/icons';
import {
  Bar,
  BarChart,
  CartesianGrid,
  Line,
  LineChart,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';

import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { useSittingsSummary } from '../api/get-sittings-summary';
import { formatShortDate, TIME_OF_DAY_LABEL, type SittingsSummary } from '../types';

const INK = '#1f2f4a';
const ACCENT = '#1c6e62';
const RULE = '#e4ddcb';

const percentText = (percent: number | null) => (percent === null ? '—' : `${percent}%`);

type Group = SittingsSummary['overall'];

const groupText = (group: Group) =>
  group.sittings === 0
    ? 'no sittings'
    : `${percentText(group.percent)} right over ${group.sittings} sitting${group.sittings === 1 ? '' : 's'}`;

function OverTime({ summary }: { summary: SittingsSummary }) {
  const points = summary.overTime
    .filter((s) => s.marked > 0)
    .map((s) => ({ ...s, label: formatShortDate(s.date) }));
  return (
    <figure className="wb-figure">
      <figcaption className="wb-figure-title">Score over time</figcaption>
      <div className="wb-chart" aria-hidden="true">
        <ResponsiveContainer width="100%" height={220}>
          <LineChart
            accessibilityLayer={false}
            data={points}
            margin={{ top: 8, right: 16, bottom: 4, left: -12 }}
          >
            <CartesianGrid stroke={RULE} strokeDasharray="3 3" />
            <XAxis dataKey="label" tick={{ fill: INK, fontSize: 12 }} />
            <YAxis domain={[0, 100]} unit="%" tick={{ fill: INK, fontSize: 12 }} />
            <Tooltip
              formatter={(value) => [`${String(value)}%`, 'Right']}
              labelFormatter={(label) => String(label)}
            />
            <Line
              type="linear"
              dataKey="percent"
              stroke={ACCENT}
              strokeWidth={2}
              dot={{ r: 3, fill: ACCENT }}
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <div className="wb-visually-hidden">
        <table>
          <caption>Score of each sitting, oldest first</caption>
          <thead>
            <tr>
              <th scope="col">Date</th>
              <th scope="col">Key</th>
              <th scope="col">Time of day</th>
              <th scope="col">Right</th>
            </tr>
          </thead>
          <tbody>
            {points.map((p) => (
              <tr key={p.sittingId}>
                <td>{p.date}</td>
                <td>{p.title}</td>
                <td>{TIME_OF_DAY_LABEL[p.timeOfDay]}</td>
                <td>
                  {p.correct} of {p.marked} ({percentText(p.percent)})
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}

function ByTimeOfDay({ summary }: { summary: SittingsSummary }) {
  const bars = summary.byTimeOfDay.map((band) => ({
    ...band,
    label: TIME_OF_DAY_LABEL[band.timeOfDay],
    value: band.percent ?? 0,
  }));
  return (
    <figure className="wb-figure">
      <figcaption className="wb-figure-title">By time of day</figcaption>
      <div className="wb-chart" aria-hidden="true">
        <ResponsiveContainer width="100%" height={180}>
          <BarChart
            accessibilityLayer={false}
            data={bars}
            margin={{ top: 8, right: 16, bottom: 4, left: -12 }}
          >
            <CartesianGrid stroke={RULE} strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="label" tick={{ fill: INK, fontSize: 12 }} />
            <YAxis domain={[0, 100]} unit="%" tick={{ fill: INK, fontSize: 12 }} />
            <Bar dataKey="value" fill={ACCENT} radius={[4, 4, 0, 0]} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <HTMLTable compact className="wb-score-table" aria-label="Scores by time of day">
        <thead>
          <tr>
            <th scope="col">Time of day</th>
            <th scope="col">Sittings</th>
            <th scope="col">Right</th>
          </tr>
        </thead>
        <tbody>
          {summary.byTimeOfDay.map((band) => (
            <tr key={band.timeOfDay}>
              <th scope="row">
                {TIME_OF_DAY_LABEL[band.timeOfDay]}{' '}
                <span className="wb-muted">
                  ({band.from}–{band.to})
                </span>
              </th>
              <td>{band.sittings}</td>
              <td>
                {band.sittings === 0
                  ? '—'
                  : `${band.correct} of ${band.marked} (${percentText(band.percent)})`}
              </td>
            </tr>
          ))}
        </tbody>
      </HTMLTable>
    </figure>
  );
}

function ByCondition({ summary }: { summary: SittingsSummary }) {
  const rows = [
    { label: 'Well rested', group: summary.byCondition.rested.yes },
    { label: 'Tired', group: summary.byCondition.rested.no },
    { label: 'Soon after a meal', group: summary.byCondition.afterMeal.yes },
    { label: 'Not after a meal', group: summary.byCondition.afterMeal.no },
  ];
  return (
    <figure className="wb-figure">
      <figcaption className="wb-figure-title">By how things were</figcaption>
      <HTMLTable compact className="wb-score-table" aria-label="Scores by condition">
        <thead>
          <tr>
            <th scope="col">Noted as</th>
            <th scope="col">Scores</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.label}>
              <th scope="row">{row.label}</th>
              <td>{groupText(row.group)}</td>
            </tr>
          ))}
        </tbody>
      </HTMLTable>
    </figure>
  );
}

/** A student's sitting scores over time and by time of day and condition, with the caution. */
export function StudentScores({
  studentId,
  studentName,
}: {
  studentId: number;
  studentName: string;
}) {
  const summary = useSittingsSummary(studentId);
  if (summary.isPending) return <LoadingState label="Loading scores…" />;
  if (summary.isError) {
    return (
      <ErrorState
        title="The scores could not be loaded."
        error={summary.error}
        onRetry={() => void summary.refetch()}
      />
    );
  }
  const data = summary.data;
  if (data.sittings === 0) {
    return (
      <EmptyState
        title={`No marked sittings for ${studentName} yet. Start a sitting after a keyed worksheet to see scores here.`}
      />
    );
  }
  return (
    <div className="wb-scores">
      <p className="wb-scores-overall">
        <strong>{groupText(data.overall)}</strong> ({data.overall.correct} of {data.overall.marked}{' '}
        items).
      </p>
      <Callout
        icon={<InfoSignIcon />}
        className="wb-caution-callout"
        title="A few sittings are not evidence"
      >
        {data.caution}
      </Callout>
      <OverTime summary={data} />
      <div className="wb-two-up">
        <ByTimeOfDay summary={data} />
        <ByCondition summary={data} />
      </div>
    </div>
  );
}
