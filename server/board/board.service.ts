import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { BoardResponse } from '../../shared/api/board.schema';
import type { AppContext } from '../app-context';
import { type Principal, seesAllDistricts } from '../auth/principal';
import { presentBoard } from './board.presenter';
import { BoardRepository } from './board.repository';

/**
 * The Ladder's data, served from stored results. The whole board is cached per process, already
 * serialised, under a version key read from PostgreSQL on every request (one small query), so a
 * season run or a new district on any instance clears every instance's cache. The full board is also
 * kept gzip-compressed (about a tenth of the bytes; compressed once per version, not per request) and
 * carries an ETag of its version, so a browser that already holds it gets a 304.
 */
export interface BoardBody {
  data: string | Buffer;
  gzip: boolean;
  etag: string;
}

export class BoardService {
  private readonly repo: BoardRepository;
  private cache: { version: string; board: BoardResponse; json: string; gzip: Buffer | null; etag: string } | null = null;

  constructor(ctx: AppContext) {
    this.repo = new BoardRepository(ctx.ds);
  }

  private async load() {
    const version = await this.repo.version();
    if (this.cache?.version !== version) {
      const board = presentBoard(await this.repo.rows());
      this.cache = { version, board, json: JSON.stringify(board), gzip: null, etag: etagOf(version) };
    }
    return this.cache;
  }

  /**
   * The board's body for this principal: community workers get their own districts (ranked among
   * themselves); everyone else the cached whole, gzip-compressed when the client accepts it.
   */
  async boardBody(p: Principal, acceptsGzip: boolean): Promise<BoardBody> {
    const cache = await this.load();
    if (!seesAllDistricts(p)) {
      const rows = cache.board.rows.filter((r) => p.districtIds.includes(r.districtId)).map((r, i) => ({ ...r, rank: i + 1 }));
      return { data: JSON.stringify({ ...cache.board, rows }), gzip: false, etag: etagOf(`${cache.version}|${[...p.districtIds].sort().join(',')}`) };
    }
    if (!acceptsGzip) return { data: cache.json, gzip: false, etag: cache.etag };
    cache.gzip ??= gzipSync(cache.json, { level: 6 });
    return { data: cache.gzip, gzip: true, etag: cache.etag };
  }
}

const etagOf = (version: string) => `W/"board-${createHash('sha1').update(version).digest('base64url')}"`;
