import { Company } from '../features/sites/company.entity.js';
import { Site } from '../features/sites/site.entity.js';
import { TrailEntry } from '../features/trail/trail-entry.entity.js';
import { User } from '../features/users/user.entity.js';

/** Every entity, listed explicitly so the DataSource needs no glob that differs between tsx and a build. */
export const entities = [Company, Site, User, TrailEntry];
