import { useEffect, useMemo, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useTranslation } from 'react-i18next';
import type { LadderRow } from '../../../shared/api/board.schema';
import { TIERS, tierRank } from '../../../shared/tier';
import { EChart } from '../../components/chart/echart-base';
import { echarts, type ChartOption } from '../../components/chart/echarts-core';
import { TIER_COLOURS, TIER_TEXT } from '../ladder/tier-scale';
import { useLadderWords } from '../ladder/ladder-format';
import type { MapSeriesOption } from 'echarts/charts';
import type { BoundariesResponse } from './api/boundaries.api';
import { cellLabel, cellSizes } from './cell-labels';

export const REGION_MAP_NAME = 'broodcast-region';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);

/**
 * The region map drawn by ECharts (lazy-loaded with this module). Areas are keyed by district id
 * (`nameProperty: 'id'`), shaded by tier on the sequential scale; the legend and the tooltip carry the tier
 * word. Clicking an area opens its District file.
 */
export default function RegionMapChart({ boundaries, rows }: { boundaries: BoundariesResponse; rows: LadderRow[] }) {
  const navigate = useNavigate();
  const { t } = useTranslation('region-map');
  const words = useLadderWords();
  const byId = useMemo(() => new Map(rows.map((r) => [r.districtId, r])), [rows]);

  // Registering again with new GeoJSON replaces the map; the key makes the option below re-read it.
  const mapKey = useMemo(() => {
    echarts.registerMap(REGION_MAP_NAME, boundaries as any);
    return boundaries.features.map((f) => f.id).join(',');
  }, [boundaries]);

  // The chart's width, so each district's label is sized to its cell (cell-labels.ts); 0 until measured.
  const frame = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = frame.current;
    if (!el) return;
    const measure = () => setWidth(Math.round(el.clientWidth));
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    return () => observer.disconnect();
  }, []);

  const option = useMemo<ChartOption>(() => {
    const few = boundaries.features.length <= 40;
    // The map's drawing box: 24rem less the series' top (8) and bottom (44), across the measured width.
    const cells = width > 0 ? cellSizes(boundaries.features, width, 384 - 8 - 44) : null;
    const labelOf = (id: string, code: string, tier: string) => (cells ? cellLabel(cells.get(id) ?? { w: 0, h: 0 }, code, tier) : ({ show: true, fontSize: 10, lines: 'codeAndTier' } as const));
    return {
      tooltip: {
        trigger: 'item',
        confine: true,
        formatter: (p: any) => {
          const r = byId.get(p.name);
          const f = boundaries.features.find((x) => x.id === p.name);
          const name = escapeHtml(r?.name ?? f?.properties.name ?? '');
          if (!r) return `${name}<br/>${escapeHtml(t('tooltipNoTier'))}`;
          const mark = words.confidence(r.confidence);
          const line = t('tooltipTier', { tier: words.tier(r.tier), score: words.score(r.score) });
          return `<strong>${name}</strong> (${escapeHtml(r.code)})<br/>${escapeHtml(line)}${mark ? `<br/>${escapeHtml(mark)}` : ''}`;
        },
      },
      visualMap: {
        type: 'piecewise' as const,
        dimension: 0,
        pieces: TIERS.map((tier, index) => ({ value: index, label: words.tier(tier), color: TIER_COLOURS[tier] })),
        orient: 'horizontal',
        left: 'center',
        bottom: 0,
        itemGap: 8,
        itemWidth: 14,
        itemHeight: 12,
        textStyle: { color: '#1d2026', fontFamily: 'Lato, sans-serif', fontSize: 11 },
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
          emphasis: { itemStyle: { borderWidth: 2.5, borderColor: '#1d2026' } },
          // A backstop: labels that still meet each other are hidden rather than drawn on top of each other.
          labelLayout: { hideOverlap: true },
          label: {
            show: few,
            fontSize: 10,
            fontFamily: 'Lato, sans-serif',
            formatter: (p: any) => {
              const r = byId.get(p.name);
              if (!r) return '';
              const fit = labelOf(p.name, r.code, words.tier(r.tier));
              return !fit.show ? '' : fit.lines === 'code' ? r.code : `${r.code}\n${words.tier(r.tier)}`;
            },
          },
          data: boundaries.features.map((f) => {
            const r = byId.get(f.id);
            const fit = r ? labelOf(f.id, r.code, words.tier(r.tier)) : null;
            return r
              ? {
                  name: f.id,
                  value: tierRank(r.tier),
                  label: fit?.show ? { color: TIER_TEXT[r.tier], fontSize: fit.fontSize } : { show: false },
                  itemStyle: { areaColor: TIER_COLOURS[r.tier] },
                }
              : { name: f.id, value: Number.NaN };
          }) as MapSeriesOption['data'],
        },
      ],
    };
    // mapKey: a new registration of the GeoJSON must redraw.
  }, [boundaries, byId, mapKey, t, words, width]);

  const onEvents = useMemo(
    () => ({
      click: (p: any) => {
        if (typeof p?.name === 'string' && p.name) void navigate(`/districts/${p.name}`);
      },
    }),
    [navigate],
  );

  return (
    <div ref={frame}>
      <EChart option={option} height="24rem" onEvents={onEvents} />
    </div>
  );
}
