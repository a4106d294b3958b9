import { useMemo } from 'react';
import { useNavigate } from 'react-router-dom';
import type { LadderRow } from '../../../shared/api/board.schema';
import { TIER_LABELS, tierRank } from '../../../shared/tier';
import { EChart } from '../../components/chart/echart';
import { echarts, type ChartOption } from '../../components/chart/echarts-core';
import { TIER_COLOURS, TIER_SCALE, TIER_TEXT } from '../ladder/tier-scale';
import { CONFIDENCE_MARKS } from '../ladder/ladder-format';
import type { MapSeriesOption } from 'echarts/charts';
import type { BoundariesResponse } from './api/boundaries.api';

export const REGION_MAP_NAME = 'broodcast-region';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);

/**
 * The region map drawn by ECharts (lazy-loaded with this module). Areas are keyed by district id
 * (`nameProperty: 'id'`), shaded by tier on the sequential scale; the legend and the tooltip carry the tier
 * word. Clicking an area opens its District file.
 */
export default function RegionMapChart({ boundaries, rows }: { boundaries: BoundariesResponse; rows: LadderRow[] }) {
  const navigate = useNavigate();
  const byId = useMemo(() => new Map(rows.map((r) => [r.districtId, r])), [rows]);

  // Registering again with new GeoJSON replaces the map; the key makes the option below re-read it.
  const mapKey = useMemo(() => {
    echarts.registerMap(REGION_MAP_NAME, boundaries as any);
    return boundaries.features.map((f) => f.id).join(',');
  }, [boundaries]);

  const option = useMemo<ChartOption>(() => {
    const few = boundaries.features.length <= 40;
    return {
      tooltip: {
        trigger: 'item',
        confine: true,
        formatter: (p: any) => {
          const r = byId.get(p.name);
          const f = boundaries.features.find((x) => x.id === p.name);
          const name = escapeHtml(r?.name ?? f?.properties.name ?? '');
          if (!r) return `${name}<br/>No tier yet`;
          const mark = CONFIDENCE_MARKS[r.confidence];
          return `<strong>${name}</strong> (${escapeHtml(r.code)})<br/>Tier: ${TIER_LABELS[r.tier]} · score ${r.score.toFixed(2)}${mark ? `<br/>${mark}` : ''}`;
        },
      },
      visualMap: {
        type: 'piecewise' as const,
        dimension: 0,
        pieces: TIER_SCALE.map((t) => ({ value: t.index, label: t.label, color: t.colour })),
        orient: 'horizontal',
        left: 'center',
        bottom: 0,
        itemGap: 12,
        textStyle: { color: '#1d2026', fontFamily: 'Lato, sans-serif' },
        outOfRange: { color: '#e9e7e2' },
        selectedMode: false,
      },
      series: [
        {
          type: 'map',
          map: REGION_MAP_NAME,
          nameProperty: 'id',
          roam: false,
          top: 8,
          bottom: 44,
          selectedMode: false,
          itemStyle: { borderColor: '#1d2026', borderWidth: 0.8, areaColor: '#e9e7e2' },
          emphasis: { itemStyle: { borderWidth: 2.5, borderColor: '#1d2026' }, label: { show: few } },
          label: {
            show: few,
            fontSize: 10,
            fontFamily: 'Lato, sans-serif',
            formatter: (p: any) => {
              const r = byId.get(p.name);
              return r ? `${r.code}\n${TIER_LABELS[r.tier]}` : '';
            },
          },
          data: boundaries.features.map((f) => {
            const r = byId.get(f.id);
            return r
              ? { name: f.id, value: tierRank(r.tier), label: { color: TIER_TEXT[r.tier] }, itemStyle: { areaColor: TIER_COLOURS[r.tier] } }
              : { name: f.id, value: Number.NaN };
          }) as MapSeriesOption['data'],
        },
      ],
    };
    // mapKey: a new registration of the GeoJSON must redraw.
  }, [boundaries, byId, mapKey]);

  const onEvents = useMemo(
    () => ({
      click: (p: any) => {
        if (typeof p?.name === 'string' && p.name) navigate(`/districts/${p.name}`);
      },
    }),
    [navigate],
  );

  return <EChart option={option} height="24rem" onEvents={onEvents} />;
}
