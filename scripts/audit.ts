/**
 * Dependency audit: `npx tsx scripts/audit.ts` runs `npm audit` twice — production dependencies at
 * high severity (the gate) and everything (for the record) — and prints one summary line each plus
 * every finding. It needs the package registry's audit service; when that does not answer (offline,
 * or a mirror without the audit endpoint) it prints "not run: registry unreachable" with the reason
 * and exits 0, so nothing else ever depends on the network. Exit 1 only when the gate finds a high or
 * critical advisory in a production dependency. docs/security.md records the last result.
 */
import { spawnSync } from 'node:child_process';

interface AuditJson {
  metadata?: { vulnerabilities?: Record<string, number>; dependencies?: { total?: number } };
  vulnerabilities?: Record<string, { severity: string; isDirect: boolean; range: string; via: (string | { title?: string; url?: string })[]; fixAvailable: unknown }>;
  error?: { code?: string; summary?: string; detail?: string };
  /** What npm prints when the audit service answers with an HTTP error. */
  message?: string;
  statusCode?: number;
}

function audit(args: string[]): { ok: true; json: AuditJson } | { ok: false; reason: string } {
  const run = spawnSync('npm', ['audit', '--json', ...args], { encoding: 'utf8', timeout: 120_000 });
  const text = run.stdout?.trim() ?? '';
  let json: AuditJson | null = null;
  try {
    json = text ? (JSON.parse(text) as AuditJson) : null;
  } catch {
    json = null;
  }
  if (!json || json.error || !json.metadata?.vulnerabilities) {
    const why = json?.error?.summary || json?.message ||
      (run.stderr || run.error?.message || '').split('\n').find((l) => /error|warn/i.test(l)) || 'no answer';
    return { ok: false, reason: why.replace(/https?:\/\/\S+/g, '<registry>').trim() };
  }
  return { ok: true, json };
}

let failed = false;
for (const [label, args] of [
  ['production dependencies, high and above (gate)', ['--omit=dev', '--audit-level=high']],
  ['all dependencies (record)', []],
] as const) {
  const result = audit([...args]);
  if (!result.ok) {
    console.log(`${label}: not run: registry unreachable (${result.reason})`);
    continue;
  }
  const v = result.json.metadata!.vulnerabilities!;
  console.log(`${label}: critical ${v.critical ?? 0}, high ${v.high ?? 0}, moderate ${v.moderate ?? 0}, low ${v.low ?? 0}`);
  for (const [name, f] of Object.entries(result.json.vulnerabilities ?? {})) {
    const titles = f.via.map((x) => (typeof x === 'string' ? `via ${x}` : x.title ?? '')).filter(Boolean).join('; ');
    console.log(`  ${f.severity.padEnd(8)} ${name} ${f.range} (${f.isDirect ? 'direct' : 'transitive'}) ${titles}`);
  }
  if ((args as readonly string[]).includes('--omit=dev') && ((v.high ?? 0) > 0 || (v.critical ?? 0) > 0)) failed = true;
}
process.exit(failed ? 1 : 0);
