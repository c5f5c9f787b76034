import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC = 'workback:public';
export const NO_HOUSEHOLD = 'workback:no-household';

/** Open to signed-out visitors. */
export const Public = () => SetMetadata(IS_PUBLIC, true);

/** Signed in, but no household membership needed (the site admin, `/auth/me`). */
export const AllowNoHousehold = () => SetMetadata(NO_HOUSEHOLD, true);
