import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'selvage:isPublic';
/** Opts a route out of the global sign-in requirement. */
export const Public = () => SetMetadata(IS_PUBLIC, true);
