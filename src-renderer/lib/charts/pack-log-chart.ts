import type { ChartConfiguration } from 'chart.js';
import { packOhmOf, type PackEvent } from '$core/pack-log';
import { SERIES } from './chart-configs';

// A pack's resistance (sum of the per-lead readings, mΩ) and capacity checks (mAh) over time.
// Dates are placed by day on a linear axis, labelled as dates.

const DAY_MS = 86_400_000;
const dayOf = (at: string): number => Math.floor(Date.parse(at.length === 10 ? `${at}T00:00:00Z` : at) / DAY_MS);
const dateLabel = (day: number): string => new Date(day * DAY_MS).toISOString().slice(0, 10);

export function packLogPoints(events: readonly PackEvent[]) {
  const resistance = events.filter((e) => e.kind === 'resistance' && e.cellResistancesOhm && e.cellResistancesOhm.length > 0).map((e) => ({ x: dayOf(e.at), y: packOhmOf(e.cellResistancesOhm ?? []) * 1000 }));
  const capacity = events.filter((e) => e.kind === 'discharge' && e.capacityCheck && e.mah !== null).map((e) => ({ x: dayOf(e.at), y: e.mah ?? 0 }));
  return { resistance, capacity };
}

export function packLogChartConfig(events: readonly PackEvent[], ratedMah: number): ChartConfiguration<'line'> {
  const { resistance, capacity } = packLogPoints(events);
  const days = [...resistance, ...capacity].map((p) => p.x);
  const x0 = Math.min(...days);
  const x1 = Math.max(...days, x0 + 1);
  return {
    type: 'line',
    data: {
      datasets: [
        { label: 'Pack resistance, measured (mΩ)', data: resistance, borderColor: SERIES.current.color, borderWidth: 2, pointRadius: 4, yAxisID: 'y' },
        { label: 'Capacity check (mAh)', data: capacity, borderColor: SERIES.power.color, borderDash: SERIES.power.dash, borderWidth: 2, pointRadius: 4, pointStyle: 'rectRot', yAxisID: 'y1' },
        {
          label: `Rated capacity ${Math.round(ratedMah)} mAh`,
          data: [
            { x: x0, y: ratedMah },
            { x: x1, y: ratedMah },
          ],
          borderColor: SERIES.power.color,
          borderDash: [2, 3],
          borderWidth: 1,
          pointRadius: 0,
          yAxisID: 'y1',
        },
      ],
    },
    options: {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      scales: {
        x: { type: 'linear', min: x0, max: x1, title: { display: true, text: 'Date' }, ticks: { callback: (v) => dateLabel(Number(v)), maxTicksLimit: 6 } },
        y: { type: 'linear', position: 'left', title: { display: true, text: 'Pack resistance (mΩ)' }, min: 0 },
        y1: { type: 'linear', position: 'right', title: { display: true, text: 'Capacity (mAh)' }, min: 0, grid: { display: false } },
      },
      plugins: { legend: { position: 'bottom', labels: { boxWidth: 18, boxHeight: 2 } } },
    },
  };
}
