import type { EntityManager } from 'typeorm';

/** The one query of the health check: whether the database answers. */
export class HealthRepository {
  constructor(private readonly manager: EntityManager) {}

  async ping(): Promise<void> {
    await this.manager.query('SELECT 1');
  }
}
