import { format, parseISO } from 'date-fns';
import type { CalibrationBrew } from '@/lib/brew-days/calibration';
import { ColumnHeads } from '@/components/column-heads';

// Predicted beside measured for each brew over time, drawn as plain SVG: one small panel per number.

const W = 640;
const H = 150;
const PAD = { left: 52, right: 12, top: 12, bottom: 26 };

interface Series {
  key: string;
  title: string;
  predicted: (b: CalibrationBrew) => number;
  measured: (b: CalibrationBrew) => number | null;
  format: (v: number) => string;
}

const SERIES: Series[] = [
  {
    key: 'og',
    title: 'OG',
    predicted: (b) => b.predictedOg,
    measured: (b) => b.measuredOg,
    format: (v) => v.toFixed(3),
  },
  {
    key: 'fg',
    title: 'FG',
    predicted: (b) => b.predictedFg,
    measured: (b) => b.measuredFg,
    format: (v) => v.toFixed(3),
  },
  {
    key: 'efficiency',
    title: 'Brewhouse efficiency',
    predicted: (b) => b.predictedEfficiencyPct,
    measured: (b) => b.measuredEfficiencyPct,
    format: (v) => `${v.toFixed(0)}%`,
  },
];

function dayNumber(iso: string): number {
  return parseISO(iso).getTime() / 86_400_000;
}

function Panel({ series, brews }: { series: Series; brews: CalibrationBrew[] }) {
  const values = brews.flatMap((b) => {
    const m = series.measured(b);
    return m === null ? [series.predicted(b)] : [series.predicted(b), m];
  });
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const margin = (hi - lo || Math.abs(hi) * 0.02 || 1) * 0.15;
  const yMin = lo - margin;
  const yMax = hi + margin;
  const first = dayNumber(brews[0].brewedOn);
  const last = dayNumber(brews[brews.length - 1].brewedOn);
  const x = (iso: string) =>
    last === first
      ? (PAD.left + W - PAD.right) / 2
      : PAD.left + ((dayNumber(iso) - first) / (last - first)) * (W - PAD.left - PAD.right);
  const y = (v: number) => PAD.top + ((yMax - v) / (yMax - yMin)) * (H - PAD.top - PAD.bottom);
  const measured = brews.flatMap((b) => {
    const m = series.measured(b);
    return m === null ? [] : [{ b, m }];
  });
  const titleId = `calibration-${series.key}`;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full font-sans"
      data-testid={`calibration-${series.key}`}
    >
      <title id={titleId}>{`${series.title}: predicted and measured, brew by brew`}</title>
      <text x={PAD.left} y={PAD.top - 2} className="fill-ink text-[11px] font-semibold">
        {series.title}
      </text>
      {[yMin + margin, yMax - margin].map((v) => (
        <g key={v}>
          <line x1={PAD.left} x2={W - PAD.right} y1={y(v)} y2={y(v)} className="stroke-line" strokeDasharray="3 3" />
          <text x={PAD.left - 6} y={y(v) + 4} textAnchor="end" className="fill-muted text-[10px]">
            {series.format(v)}
          </text>
        </g>
      ))}
      {brews.map((b) => {
        const m = series.measured(b);
        const p = series.predicted(b);
        return (
          <g key={b.brewDayId}>
            {m !== null && (
              <line
                x1={x(b.brewedOn)}
                x2={x(b.brewedOn)}
                y1={y(p)}
                y2={y(m)}
                className="stroke-muted"
                strokeWidth={1}
              />
            )}
            <circle cx={x(b.brewedOn)} cy={y(p)} r={4} className="fill-card stroke-bine" strokeWidth={2}>
              <title>{`${b.recipeTitle}, ${b.brewedOn}: predicted ${series.format(p)}`}</title>
            </circle>
          </g>
        );
      })}
      <polyline
        points={measured.map(({ b, m }) => `${x(b.brewedOn)},${y(m)}`).join(' ')}
        fill="none"
        className="stroke-copper"
        strokeWidth={1.5}
      />
      {measured.map(({ b, m }) => (
        <circle key={b.brewDayId} cx={x(b.brewedOn)} cy={y(m)} r={4} className="fill-copper">
          <title>{`${b.recipeTitle}, ${b.brewedOn}: measured ${series.format(m)}`}</title>
        </circle>
      ))}
      <text x={PAD.left} y={H - 6} className="fill-muted text-[10px]">
        {format(parseISO(brews[0].brewedOn), 'd MMM yyyy')}
      </text>
      <text x={W - PAD.right} y={H - 6} textAnchor="end" className="fill-muted text-[10px]">
        {format(parseISO(brews[brews.length - 1].brewedOn), 'd MMM yyyy')}
      </text>
    </svg>
  );
}

/** OG, FG and efficiency, predicted (open rings) against measured (filled dots), over the brewer's brew days. */
export function CalibrationChart({ brews }: { brews: CalibrationBrew[] }) {
  if (brews.length === 0) return null;
  return (
    <section aria-labelledby="calibration-chart-title" className="kf-card">
      <h2 id="calibration-chart-title" className="text-lg font-semibold">
        Predicted and measured, brew by brew
      </h2>
      <p className="mt-1 font-sans text-xs text-muted">
        <svg viewBox="0 0 10 10" className="inline h-3 w-3 align-middle" aria-hidden="true">
          <circle cx="5" cy="5" r="3.5" className="fill-card stroke-bine" strokeWidth="1.5" />
        </svg>{' '}
        the version&apos;s prediction ·{' '}
        <svg viewBox="0 0 10 10" className="inline h-3 w-3 align-middle" aria-hidden="true">
          <circle cx="5" cy="5" r="4" className="fill-copper" />
        </svg>{' '}
        what you measured
      </p>
      <div className="mt-2 max-w-3xl space-y-3">
        {SERIES.map((s) => (
          <Panel key={s.key} series={s} brews={brews} />
        ))}
      </div>
      <details className="mt-2 font-sans text-sm">
        <summary>The numbers as a table</summary>
        <table className="mt-2 w-full text-left text-xs">
          <ColumnHeads names={['Brewed', 'Recipe', 'OG', 'FG', 'Efficiency']} className="text-muted" />
          <tbody className="kf-data">
            {brews.map((b) => (
              <tr key={b.brewDayId}>
                <td>{b.brewedOn}</td>
                <td>{b.recipeTitle}</td>
                {SERIES.map((s) => {
                  const m = s.measured(b);
                  return (
                    <td key={s.key}>
                      {m === null ? '—' : s.format(m)} <span className="text-muted">/ {s.format(s.predicted(b))}</span>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </section>
  );
}
