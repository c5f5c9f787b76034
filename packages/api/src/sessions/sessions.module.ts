import { Global, Module } from '@nestjs/common';
import { SessionStoreService } from './session-store.service.js';

@Global()
@Module({ providers: [SessionStoreService], exports: [SessionStoreService] })
export class SessionsModule {}
