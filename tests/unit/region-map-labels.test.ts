import { describe, expect, it } from 'vitest';
import { buildDemoRegion } from '../../sample/demo-region';
import { cellLabel, cellSizes } from '../../src/features/region-map/cell-labels';

/** Issue 21: the region map's labels (code and tier word) stay inside their own district's cell. */
const features = buildDemoRegion().map((d, i) => ({ id: `d${i}`, code: d.code, properties: { name: d.name, code: d.code }, geometry: d.boundary })) as any[];
const MAP_HEIGHT = 384 - 8 - 44;

describe('region map labels sized by their cell', () => {
  it('when the 12 demo districts are drawn 1200 px wide, then the tall map is bound by its height and the narrow cells carry their code only, smaller', () => {
    const cells = cellSizes(features, 1200, MAP_HEIGHT);
    const fits = features.map((f) => cellLabel(cells.get(f.id)!, f.code, 'Critique'));
    expect(fits.every((x) => !x.show || x.lines === 'code')).toBe(true);
    expect(fits.filter((x) => x.show).length).toBeGreaterThanOrEqual(10);
  });

  it('when they are drawn 290 px wide (a 360 px phone), then no label is wider than its cell allows: smaller, code only or none', () => {
    const cells = cellSizes(features, 290, MAP_HEIGHT);
    for (const f of features) {
      const cell = cells.get(f.id)!;
      const fit = cellLabel(cell, f.code, 'Moderado');
      if (!fit.show) continue;
      const longest = fit.lines === 'code' ? f.code.length : Math.max(f.code.length, 'Moderado'.length);
      // The estimate the labels are sized by (0.6 em a glyph) must stay within the usable 70 % of the cell.
      expect(longest * fit.fontSize * 0.6).toBeLessThanOrEqual(cell.w * 0.7);
    }
    const wide = cellSizes(features, 1200, MAP_HEIGHT);
    // The cells never grow when the chart narrows (the map keeps its aspect).
    expect(cells.get('d0')!.w).toBeLessThanOrEqual(wide.get('d0')!.w);
  });

  it('when a cell is too small for even its code, then its label is hidden (the tooltip, legend and Ladder still name it)', () => {
    expect(cellLabel({ w: 20, h: 10 }, 'HV-05', 'High')).toEqual({ show: false });
    expect(cellLabel({ w: 60, h: 16 }, 'HV-05', 'Critical')).toEqual({ show: true, fontSize: 8, lines: 'code' });
  });
});
