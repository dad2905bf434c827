import type { EventEmitter } from 'node:events';
import type { Request } from 'express';
import session from 'express-session';
import MySQLStoreFactory from 'express-mysql-session';
import type { DataSource } from 'typeorm';
import { Membership, User } from '../entities/index.js';
import { tableOf } from '../services/raw-rows.js';
import type { Role } from '../../shared/api/roles.js';

/** The signed-in person's membership and user, read in the same query as their session. */
export interface SessionMemberRow {
  id: number;
  userId: number;
  studioId: number;
  role: Role;
  status: 'active' | 'deactivated';
  email: string;
  name: string;
}

const MEMBER = Symbol('warpmeter.sessionMember');
type WithMember = { [MEMBER]?: SessionMemberRow | null };

/** The member row the session store read beside this request's session: undefined when it did not read one. */
export function sessionMemberOf(req: Request): SessionMemberRow | null | undefined {
  return (req as Request & WithMember)[MEMBER];
}

interface StoredRow {
  data: string | null;
  expires: number;
  mId: number | null;
  mUserId: number | null;
  studioId: number | null;
  role: Role | null;
  status: SessionMemberRow['status'] | null;
  email: string | null;
  name: string | null;
}

type Callback = (err: unknown, sess?: session.SessionData | null) => void;

/** The stored session with its member row attached (under a symbol, so it is never saved back); null when missing or expired. */
function sessionOf(row: StoredRow | undefined): (session.SessionData & WithMember) | null {
  if (!row || row.expires < Math.round(Date.now() / 1000) || row.data === null) return null;
  const data = JSON.parse(row.data) as session.SessionData & WithMember;
  data[MEMBER] =
    row.mId === null
      ? null
      : { id: row.mId, userId: row.mUserId!, studioId: row.studioId!, role: row.role!, status: row.status!, email: row.email!, name: row.name! };
  return data;
}

/**
 * express-mysql-session's store on the app's own connection pool, with one change: reading a
 * session also reads its membership and user, joined on the membership id inside the stored
 * JSON. A signed-in request then costs one database round trip before its route instead of two
 * (session, then membership), and the member row is always as fresh as the session itself —
 * nothing is cached, so a role change, a deactivation or a sign-out everywhere (which deletes
 * the rows) takes effect on the very next request.
 */
export function createSessionStore(ds: DataSource) {
  /** What the subclass uses of express-mysql-session's store (the package ships no types). */
  interface MySQLStoreBase extends EventEmitter {
    get(sid: string, cb: Callback): void;
    set(sid: string, data: session.SessionData, cb?: (err?: unknown) => void): void;
    destroy(sid: string, cb?: (err?: unknown) => void): void;
    touch(sid: string, data: session.SessionData, cb?: (err?: unknown) => void): void;
    createSession(req: Request, sess: session.SessionData): session.Session & session.SessionData;
    query(sql: string, params: unknown[]): Promise<[StoredRow[], unknown]>;
    close(): Promise<void>;
  }
  const MySQLStore = MySQLStoreFactory(session as never) as unknown as new (options: object, connection: unknown) => MySQLStoreBase;
  const memberships = tableOf(ds, Membership);
  const users = tableOf(ds, User);
  const pool = (ds.driver as unknown as { pool: unknown }).pool;

  class StudioSessionStore extends MySQLStore {
    private readonly readSql =
      'SELECT s.`data`, s.`expires`, m.id AS mId, m.userId AS mUserId, m.studioId, m.role, m.status, u.email, u.name ' +
      'FROM `sessions` s ' +
      `LEFT JOIN ${memberships} m ON m.id = CAST(JSON_VALUE(s.\`data\`, '$.membershipId') AS UNSIGNED) ` +
      `LEFT JOIN ${users} u ON u.id = m.userId ` +
      'WHERE s.`session_id` = ?';

    override get(sid: string, cb: Callback): void {
      this.query(this.readSql, [sid])
        .then(([rows]) => sessionOf(rows[0]))
        .then(
          (sess) => cb(null, sess),
          (err) => cb(err),
        );
    }

    /** Moves the member row from the stored data onto the request (it is never saved back). */
    override createSession(req: Request, sess: session.SessionData): session.Session & session.SessionData {
      const withMember = sess as session.SessionData & WithMember;
      if (MEMBER in withMember) {
        (req as Request & WithMember)[MEMBER] = withMember[MEMBER];
        delete withMember[MEMBER];
      }
      return super.createSession(req, sess);
    }
  }

  return new StudioSessionStore(
    {
      createDatabaseTable: false,
      clearExpired: true,
      checkExpirationInterval: 15 * 60 * 1000,
      // The pool belongs to the data source, which closes it.
      endConnectionOnClose: false,
    },
    pool,
  );
}
