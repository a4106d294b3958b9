/**
 * Whether `npm start` loads the invented demo region: yes unless `BROODCAST_DEMO` says 0 / false / no / off
 * or the `--no-demo` option is given. Anything else in the variable is refused, so a typo does not silently
 * load (or leave out) the demo.
 */
export function demoWanted(env: Record<string, string | undefined>, args: ReadonlySet<string>): boolean {
  if (args.has('--no-demo')) return false;
  const value = env.BROODCAST_DEMO?.trim().toLowerCase();
  if (value === undefined || value === '') return true;
  if (['0', 'false', 'no', 'off'].includes(value)) return false;
  if (['1', 'true', 'yes', 'on'].includes(value)) return true;
  throw new Error(`BROODCAST_DEMO must be 1 (load the demo region) or 0 (start empty), not "${env.BROODCAST_DEMO}"`);
}
