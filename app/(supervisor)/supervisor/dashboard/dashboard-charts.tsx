'use client';

import type { ReactNode } from 'react';
import {
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import type { OfficeDashboard } from '@/lib/schemas/dashboard';
import { Panel } from '@/components/ui/panel';

// Axis and text colours come from the theme tokens, so the charts follow day and night.
const ink = 'rgb(var(--ink))';
const muted = 'rgb(var(--muted))';
const systemColours = [
  '#2f6f9f',
  '#c6a700',
  '#7a4fa0',
  '#16703e',
  '#b85c1f',
  '#4a4e56',
  '#0f8a8a',
  '#9c2f5e',
  '#5b7f1a',
  '#8a6d3b',
  '#3f51b5',
  '#a0522d',
];

function Card({ title, note, children }: { title: string; note: string; children: ReactNode }) {
  return (
    <Panel as="section" aria-label={title}>
      <h2 className="text-lg font-extrabold">{title}</h2>
      <p className="mb-2 text-sm text-muted">{note}</p>
      <div className="h-64">{children}</div>
    </Panel>
  );
}

const axis = { stroke: muted, tick: { fill: muted, fontSize: 12 } };
const tooltip = { contentStyle: { background: 'rgb(var(--panel))', border: '2px solid rgb(var(--edge))', color: ink } };

export function DashboardCharts({ data }: { data: OfficeDashboard }) {
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <Card
        title="Defects by system, per week"
        note="Every defect reported, by the system its component belongs to (weeks start Monday)."
      >
        <ResponsiveContainer>
          <BarChart data={data.defectsBySystem}>
            <CartesianGrid strokeDasharray="3 3" stroke="rgb(var(--edge) / 0.15)" />
            <XAxis dataKey="week" {...axis} />
            <YAxis allowDecimals={false} {...axis} />
            <Tooltip {...tooltip} />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            {data.systems.map((s, i) => (
              <Bar key={s} dataKey={s} stackId="s" fill={systemColours[i % systemColours.length]} />
            ))}
          </BarChart>
        </ResponsiveContainer>
      </Card>
      <Card
        title="Major defects open"
        note="At the end of each day: reported and not yet certified repaired. Each one keeps a unit out of service."
      >
        <ResponsiveContainer>
          <BarChart data={data.openMajorByDay} barCategoryGap={1}>
            <CartesianGrid strokeDasharray="3 3" stroke="rgb(var(--edge) / 0.15)" />
            <XAxis dataKey="day" {...axis} minTickGap={24} />
            <YAxis allowDecimals={false} {...axis} />
            <Tooltip {...tooltip} />
            <Bar dataKey="open" name="open major defects" fill="rgb(var(--major))" />
          </BarChart>
        </ResponsiveContainer>
      </Card>
      <Card
        title="Time taken, against the minimum"
        note={`Inspections by whole minutes taken, last 60 days. Lines: fleet minimum ${data.minimums.preTrip} min pre-trip, ${data.minimums.postTrip} min post-trip (fleet setting; no regulation sets one).`}
      >
        <ResponsiveContainer>
          <BarChart data={data.durationBuckets}>
            <CartesianGrid strokeDasharray="3 3" stroke="rgb(var(--edge) / 0.15)" />
            <XAxis
              dataKey="minutes"
              {...axis}
              label={{ value: 'minutes', position: 'insideBottomRight', offset: -4, fill: muted, fontSize: 12 }}
            />
            <YAxis allowDecimals={false} {...axis} />
            <Tooltip {...tooltip} />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            <Bar dataKey="preTrip" name="pre-trip" fill="#2f6f9f" />
            <Bar dataKey="postTrip" name="post-trip" fill="#9aa3ad" />
            <ReferenceLine
              x={data.minimums.preTrip}
              stroke={ink}
              strokeWidth={2}
              strokeDasharray="6 3"
              label={{ value: `pre-trip min ${data.minimums.preTrip}`, fill: ink, fontSize: 12, position: 'top' }}
            />
            <ReferenceLine x={data.minimums.postTrip} stroke={muted} strokeWidth={2} strokeDasharray="2 3" />
          </BarChart>
        </ResponsiveContainer>
      </Card>
      <Card
        title="Matched on the first try, by zone"
        note="Spoken findings and readings accepted as heard, against those the driver had to confirm or correct. Lowest zones first."
      >
        <ResponsiveContainer>
          <BarChart data={data.recognition} layout="vertical" margin={{ left: 40 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="rgb(var(--edge) / 0.15)" />
            <XAxis type="number" domain={[0, 100]} unit="%" {...axis} />
            <YAxis type="category" dataKey="zone" width={130} {...axis} />
            <Tooltip {...tooltip} formatter={(v) => `${String(v ?? '')}%`} />
            <Bar dataKey="share" name="first try" fill="#16703e" />
          </BarChart>
        </ResponsiveContainer>
      </Card>
    </div>
  );
}
