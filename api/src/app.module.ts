import { MikroOrmModule } from '@mikro-orm/nestjs';
import { Module, RequestMethod } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { LoggerModule } from 'nestjs-pino';
import { AuthModule } from './auth/auth.module';
import { HttpErrorFilter } from './common/filters/http-error.filter';
import { AuthenticatedGuard } from './common/guards/authenticated.guard';
import { GuildAccessGuard } from './common/guards/guild-access.guard';
import { OriginGuard } from './common/guards/origin.guard';
import { appConfig, authConfig, beesConfig, mailConfig, paymentsConfig } from './config/app.config';
import { validateEnv } from './config/env.validation';
import { DashboardModule } from './dashboard/dashboard.module';
import { DeparturesModule } from './departures/departures.module';
import { DuesModule } from './dues/dues.module';
import { DevInboxModule } from './dev-inbox/dev-inbox.module';
import { GuildsModule } from './guilds/guilds.module';
import { BeesModule } from './bees/bees.module';
import { HealthModule } from './health/health.module';
import { LayoutModule } from './layout/layout.module';
import { RoundsModule } from './rounds/rounds.module';
import { SizeCheckModule } from './size-check/size-check.module';
import { ShowsModule } from './shows/shows.module';
import { MailPreferencesModule } from './mail-preferences/mail-preferences.module';
import { StorageModule } from './storage/storage.module';
import { HousekeepingModule } from './housekeeping/housekeeping.module';
import { InvitationsModule } from './invitations/invitations.module';
import { OfficesModule } from './offices/offices.module';
import ormConfig from './mikro-orm.config';
import { OutboxModule } from './outbox/outbox.module';
import { ProfileModule } from './profile/profile.module';
import { RosterImportModule } from './roster-import/roster-import.module';

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, validate: validateEnv, load: [appConfig, authConfig, mailConfig, beesConfig, paymentsConfig] }),
    LoggerModule.forRoot({
      forRoutes: [{ path: '{*path}', method: RequestMethod.ALL }],
      pinoHttp: {
        level: process.env.LOG_LEVEL ?? 'info',
        redact: ['req.headers.cookie', 'res.headers["set-cookie"]'],
        autoLogging: { ignore: (req) => req.url === '/api/health' },
        // One readable line per event for people at a terminal; JSON lines for log collectors.
        transport:
          process.env.NODE_ENV === 'development' || process.env.LOG_PRETTY === 'true'
            ? { target: 'pino-pretty', options: { singleLine: true, ignore: 'pid,hostname,req,res', translateTime: 'SYS:HH:MM:ss' } }
            : undefined,
      },
    }),
    MikroOrmModule.forRoot({ ...ormConfig, registerRequestContext: true, autoLoadEntities: false }),
    ScheduleModule.forRoot(),
    OutboxModule,
    AuthModule,
    GuildsModule,
    InvitationsModule,
    ProfileModule,
    DeparturesModule,
    DashboardModule,
    DevInboxModule,
    HealthModule,
    HousekeepingModule,
    StorageModule,
    BeesModule,
    RoundsModule,
    LayoutModule,
    SizeCheckModule,
    DuesModule,
    ShowsModule,
    MailPreferencesModule,
    RosterImportModule,
    OfficesModule,
  ],
  providers: [
    { provide: APP_FILTER, useClass: HttpErrorFilter },
    // Order matters: refuse cross-site writes, then require a session, then check the guild role.
    { provide: APP_GUARD, useClass: OriginGuard },
    { provide: APP_GUARD, useClass: AuthenticatedGuard },
    { provide: APP_GUARD, useClass: GuildAccessGuard },
  ],
})
export class AppModule {}
