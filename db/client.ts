import { createClient, type Client } from "@libsql/client";
import { drizzle, type LibSQLDatabase } from "drizzle-orm/libsql";
import * as users from "./schema/users";
import * as apiTokens from "./schema/api-tokens";
import * as fleet from "./schema/fleet";
import * as audit from "./schema/audit";
import * as mail from "./schema/mail";
import * as changes from "./schema/changes";
import * as files from "./schema/files";
import * as windows from "./schema/windows";
import * as instruments from "./schema/instruments";
import * as runs from "./schema/runs";
import * as maintenance from "./schema/maintenance";
import * as drift from "./schema/drift";

export const schema = { ...users, ...apiTokens, ...fleet, ...audit, ...mail, ...changes, ...files, ...windows, ...instruments, ...runs, ...maintenance, ...drift };
export type Db = LibSQLDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
export type DbOrTx = Db | Tx;

/**
 * With one connection, libSQL refuses (TRANSACTION_ACTIVE) any statement sent while a
 * transaction holds it — so two requests at once, e.g. two people closing the same work order,
 * made one of them fail with a 500. This wrapper queues instead: statements and transactions
 * take turns on the connection, a transaction keeping its turn until it commits or rolls back.
 * A statement sent on the outer client from inside a transaction would wait for ever, so a
 * wait longer than the busy timeout is reported as an error.
 */
function queueOnOneConnection(client: Client, waitMs: number): Client {
  let tail: Promise<void> = Promise.resolve();
  const turn = async (): Promise<() => void> => {
    let release!: () => void;
    const mine = new Promise<void>((r) => (release = r));
    const before = tail;
    tail = tail.then(() => mine);
    let timer: ReturnType<typeof setTimeout> | undefined;
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`Waited ${waitMs} ms for the database connection; is a statement using the outer client inside a transaction?`)), waitMs);
    });
    try {
      await Promise.race([before, timeout]);
    } catch (e) {
      // Give the turn up when it comes, so the queue keeps moving.
      before.then(release);
      throw e;
    } finally {
      clearTimeout(timer);
    }
    return release;
  };
  const queued = <A extends unknown[], R>(fn: (...args: A) => Promise<R>) => async (...args: A): Promise<R> => {
    const release = await turn();
    try {
      return await fn(...args);
    } finally {
      release();
    }
  };
  return new Proxy(client, {
    get(target, prop, receiver) {
      if (prop === "execute" || prop === "batch" || prop === "executeMultiple" || prop === "migrate") {
        return queued((target[prop] as (...a: unknown[]) => Promise<unknown>).bind(target));
      }
      if (prop === "transaction") {
        return async (...args: Parameters<Client["transaction"]>) => {
          const release = await turn();
          let tx;
          try {
            tx = await target.transaction(...args);
          } catch (e) {
            release();
            throw e;
          }
          let done = false;
          const finish = () => {
            if (!done) {
              done = true;
              release();
            }
          };
          for (const m of ["commit", "rollback"] as const) {
            const orig = tx[m].bind(tx);
            tx[m] = async () => {
              try {
                return await orig();
              } finally {
                finish();
              }
            };
          }
          const close = tx.close.bind(tx);
          tx.close = () => {
            close();
            finish();
          };
          return tx;
        };
      }
      return Reflect.get(target, prop, receiver);
    },
  });
}

/**
 * Opens the database. Used by the app (db/index.ts), scripts and tests alike.
 * For an embedded file the pool is one connection: SQLite has one writer anyway, and the
 * per-connection pragmas (foreign keys) then hold for every statement. busy_timeout is
 * libSQL's `timeout` option, which applies to each connection it opens.
 */
export async function openDatabase(url: string, authToken?: string): Promise<{ db: Db; client: Client }> {
  const isFile = url.startsWith("file:");
  if (isFile) {
    const path = url.slice("file:".length);
    const dir = path.includes("/") ? path.slice(0, path.lastIndexOf("/")) : "";
    if (dir) {
      const fs = await import("node:fs");
      fs.mkdirSync(dir, { recursive: true });
    }
  }
  const client = createClient({ url, authToken, concurrency: isFile ? 1 : 20, timeout: 10_000 } as Parameters<typeof createClient>[0]);
  if (isFile) {
    await client.execute("PRAGMA journal_mode=WAL");
    await client.execute("PRAGMA synchronous=NORMAL");
    await client.execute("PRAGMA busy_timeout=10000");
    await client.execute("PRAGMA foreign_keys=ON");
  } else {
    // A libSQL server refuses connection pragmas (busy_timeout is "unsupported"), and over HTTP each
    // request is its own stream, so a pragma set here would not hold for the next statement anyway.
    // The server enforces foreign keys itself (sqld's default); refuse one that does not.
    const fk = await client.execute("PRAGMA foreign_keys");
    if (Number(fk.rows[0]?.[0]) !== 1) throw new Error(`The libSQL server at ${url} does not enforce foreign keys; Ovenward relies on them.`);
  }
  const shared = isFile ? queueOnOneConnection(client, 30_000) : client;
  return { db: drizzle(shared, { schema }), client };
}
