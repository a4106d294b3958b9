import type { BoardResponse } from '../../shared/api/board.schema';
import type { AppContext } from '../app-context';
import { type Principal, seesAllDistricts } from '../auth/principal';
import { presentBoard } from './board.presenter';
import { BoardRepository } from './board.repository';

/**
 * The Ladder's data, served from stored results. The whole board is cached per process, already
 * serialised, under a version key read from PostgreSQL on every request (one small query), so a
 * season run or a new district on any instance clears every instance's cache.
 */
export class BoardService {
  private readonly repo: BoardRepository;
  private cache: { version: string; board: BoardResponse; json: string } | null = null;

  constructor(ctx: AppContext) {
    this.repo = new BoardRepository(ctx.ds);
  }

  private async load() {
    const version = await this.repo.version();
    if (this.cache?.version !== version) {
      const board = presentBoard(await this.repo.rows());
      this.cache = { version, board, json: JSON.stringify(board) };
    }
    return this.cache;
  }

  /** The board as JSON text for this principal (community workers: their own districts). */
  async boardJson(p: Principal): Promise<string> {
    const cache = await this.load();
    if (seesAllDistricts(p)) return cache.json;
    const rows = cache.board.rows.filter((r) => p.districtIds.includes(r.districtId)).map((r, i) => ({ ...r, rank: i + 1 }));
    return JSON.stringify({ ...cache.board, rows });
  }
}
