import type { Role } from '../shared/roles';
import type { Db } from './db/client';
import type { Mailer } from './mail/mailer';

/** Everything the app needs from outside; tests build it with a real database and the fake mail server. */
export interface AppDeps {
  db: Db;
  mailer: Mailer;
  config: {
    sessionSecret: Uint8Array;
    sessionHours: number;
    cookieSecure: boolean;
    /** Allowed origin for state-changing requests and for links in e-mails; when unset, the request's own host. */
    appOrigin?: string;
    trustProxy?: string;
    /** Folder for uploaded attachments (default .data/uploads). */
    uploadDir?: string;
    /** Folder of the built client to serve, when it exists. */
    clientDir?: string;
  };
  now: () => Date;
  /** The background job queue (server/jobs); absent in tests that run without it. */
  jobs?: JobQueue;
}

/** What request handlers may queue as background work. */
export interface JobQueue {
  /** Refit a vessel's curves after its logs changed (e.g. after an import). */
  enqueueRefit(job: { companyId: string; vesselId: string }): Promise<void>;
}

/** The signed-in member acting on a request. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  companyId: string;
  companyName: string;
  currency: string;
  membershipId: string;
  role: Role;
  /** null: every vessel of the company. */
  vesselIds: string[] | null;
  sessionId: string;
  sessionExpiresAt: Date;
}
