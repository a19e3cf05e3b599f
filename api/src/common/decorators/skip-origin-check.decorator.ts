import { SetMetadata } from '@nestjs/common';

export const SKIP_ORIGIN_CHECK = 'selvage:skipOriginCheck';
/** For server-to-server callbacks (signed webhooks) that carry no browser origin and no cookie. */
export const SkipOriginCheck = () => SetMetadata(SKIP_ORIGIN_CHECK, true);
