import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { demoWanted } from '../../scripts/lib/demo-flag';

// Issue 17 item 4: `BROODCAST_DEMO=0 npm start` starts an empty installation.
describe('the demo flag of npm start', () => {
  it('when BROODCAST_DEMO is unset or 1, then the demo loads; when 0, false, no or off (or --no-demo), then it does not', () => {
    const none = new Set<string>();
    expect(demoWanted({}, none)).toBe(true);
    expect(demoWanted({ BROODCAST_DEMO: '' }, none)).toBe(true);
    expect(demoWanted({ BROODCAST_DEMO: '1' }, none)).toBe(true);
    expect(demoWanted({ BROODCAST_DEMO: 'yes' }, none)).toBe(true);
    for (const v of ['0', 'false', 'No', ' off ']) expect(demoWanted({ BROODCAST_DEMO: v }, none)).toBe(false);
    expect(demoWanted({ BROODCAST_DEMO: '1' }, new Set(['--no-demo']))).toBe(false);
  });

  it('when BROODCAST_DEMO holds anything else, then the start stops and says what it accepts', () => {
    expect(() => demoWanted({ BROODCAST_DEMO: 'maybe' }, new Set())).toThrow(/BROODCAST_DEMO must be 1 .* or 0/);
  });

  it('when npm start runs, then scripts/start.ts reads the flag and asks for the first admin link only without the demo', () => {
    const source = readFileSync(new URL('../../scripts/start.ts', import.meta.url), 'utf8');
    expect(source).toMatch(/withDemo = demoWanted\(process\.env, args\)/);
    expect(source).toMatch(/withDemo \? null : await firstAdmin\(/);
  });
});
