import type { DataSource } from 'typeorm';

/** Whether the app can reach its database, for load balancers and the start script. */
export class HealthService {
  constructor(private readonly dataSource: DataSource) {}

  async databaseReachable(): Promise<boolean> {
    try {
      await this.dataSource.query('SELECT 1');
      return true;
    } catch {
      return false;
    }
  }
}
