'use client';

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';

export interface ChartPoint {
  day: number;
  gravity: number | null;
  temp: number | null;
}

/** Gravity and temperature over the days since brewing, with the predicted FG as a reference line. */
export function FermentationChart({
  points,
  predictedFg,
  tempLabel,
}: {
  points: ChartPoint[];
  predictedFg: number;
  tempLabel: string;
}) {
  const gravities = points.flatMap((p) => (p.gravity === null ? [] : [p.gravity]));
  const low = Math.min(predictedFg, ...gravities) - 0.004;
  const high = Math.max(predictedFg, ...gravities) + 0.004;
  return (
    <figure aria-label="Fermentation chart: gravity and temperature by day">
      <div className="h-72 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={points} margin={{ top: 10, right: 10, bottom: 10, left: 10 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="rgb(var(--kf-line))" />
            <XAxis
              dataKey="day"
              type="number"
              domain={['dataMin', 'dataMax']}
              allowDecimals={false}
              label={{ value: 'Day', position: 'insideBottom', offset: -5 }}
            />
            <YAxis yAxisId="gravity" domain={[low, high]} tickFormatter={(v: number) => v.toFixed(3)} width={56} />
            <YAxis
              yAxisId="temp"
              orientation="right"
              width={44}
              domain={['dataMin - 2', 'dataMax + 2']}
              tickFormatter={(v: number) => `${Math.round(v)}`}
            />
            <Tooltip
              formatter={(value, name) =>
                typeof value === 'number'
                  ? [name === 'Gravity' ? value.toFixed(3) : `${value.toFixed(1)} ${tempLabel}`, name]
                  : [String(value), name]
              }
            />
            <Legend />
            <ReferenceLine
              yAxisId="gravity"
              y={predictedFg}
              stroke="rgb(var(--kf-bine))"
              strokeDasharray="6 4"
              label={{ value: `Predicted FG ${predictedFg.toFixed(3)}`, position: 'insideTopRight' }}
            />
            <Line
              yAxisId="gravity"
              type="monotone"
              dataKey="gravity"
              name="Gravity"
              stroke="rgb(var(--kf-copper))"
              strokeWidth={2}
              connectNulls
              isAnimationActive={false}
            />
            <Line
              yAxisId="temp"
              type="monotone"
              dataKey="temp"
              name={`Temperature (${tempLabel})`}
              stroke="rgb(var(--kf-muted))"
              strokeWidth={1.5}
              connectNulls
              isAnimationActive={false}
            />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="font-sans text-xs text-muted">
        Dashed line: the version&apos;s predicted final gravity.
      </figcaption>
    </figure>
  );
}
