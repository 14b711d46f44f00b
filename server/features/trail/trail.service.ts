import type { DataSource } from 'typeorm';
import { can } from '../../contracts/permissions.js';
import type { TrailQuery } from '../../contracts/trail.js';
import type { CurrentUser } from '../../auth/current-user.js';
import { pageTrail, verifyChain } from './trail.repository.js';

/** Reading the trail (writing it is the kernel's recordTrail, inside each change's transaction). */
export class TrailService {
  constructor(private readonly dataSource: DataSource) {}

  /** Entries of a site: whoever may see the site. Entries of no site (people, sign-ins): by permission. */
  list(user: CurrentUser, query: TrailQuery) {
    return pageTrail(this.dataSource, user.siteIds, can(user.role, 'trail.read-siteless'), query);
  }

  /** Whether every entry still holds its hash and follows the one before (tampering shows here). */
  verify() {
    return verifyChain(this.dataSource);
  }
}
