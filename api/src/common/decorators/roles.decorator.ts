import { SetMetadata } from '@nestjs/common';
import type { Role } from '../../guilds/roles';

export const REQUIRED_ROLES = 'selvage:roles';
/** The officer roles (any of them) a member needs in the route's guild; admins always pass. */
export const Roles = (...roles: Role[]) => SetMetadata(REQUIRED_ROLES, roles);
