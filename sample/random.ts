/** The demo's seeded generator: the one in shared/stats/random.ts. */
export { seededRandom } from '../shared/stats/random';
