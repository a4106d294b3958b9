import { build } from 'vite';

/** Build the client into dist/client (about two seconds). */
export async function buildClient() {
  await build({ logLevel: 'warn', configFile: 'vite.config.ts' });
}
