import { Company } from '../kernel/sites/company.entity.js';
import { Site } from '../kernel/sites/site.entity.js';
import { TrailEntry } from '../kernel/trail/trail-entry.entity.js';
import { User } from '../kernel/people/user.entity.js';

/** Every entity, listed explicitly so the DataSource needs no glob that differs between tsx and a build. */
export const entities = [Company, Site, User, TrailEntry];
