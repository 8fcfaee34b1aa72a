import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { createHash, randomUUID } from 'node:crypto';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface StoredMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** Files sent with it: name, type, size and SHA-256 of the bytes (the bytes are not kept). */
  attachments?: { filename: string; contentType: string; size: number; sha256: string }[];
}

export interface Outbox {
  list(): Promise<StoredMail[]>;
}

/** Reads what the SMTP fake stored on disk: the /dev/outbox page works even when the fake runs in another process. */
export function directoryOutbox(dir: string): Outbox {
  return {
    async list() {
      const names = await readdir(dir).catch(() => []);
      const mails = await Promise.all(
        names
          .filter((n) => n.endsWith('.json'))
          .map(async (n) => JSON.parse(await readFile(join(dir, n), 'utf8')) as StoredMail),
      );
      return mails.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
    },
  };
}

export interface SmtpFake extends Outbox {
  port: number;
  messages: StoredMail[];
  /** Resolves with the next message whose recipient matches, for tests. */
  waitFor(to: string, timeoutMs?: number): Promise<StoredMail>;
  close(): Promise<void>;
}

/** A local SMTP receiver on loopback (the `smtp-server` package) that keeps every message it is given. */
export async function startSmtpFake(opts: { port: number; host?: string; dir?: string }): Promise<SmtpFake> {
  const messages: StoredMail[] = [];
  const waiters: Array<{ to: string; resolve: (m: StoredMail) => void }> = [];
  if (opts.dir) await mkdir(opts.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const toField = Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : [];
          const mail: StoredMail = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? '',
            to: toField.flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase())),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            attachments: parsed.attachments.map((a) => ({
              filename: a.filename ?? '',
              contentType: a.contentType,
              size: a.content.length,
              sha256: createHash('sha256').update(a.content).digest('hex'),
            })),
          };
          messages.push(mail);
          if (opts.dir)
            await writeFile(
              join(opts.dir, `${mail.receivedAt.replace(/[:.]/g, '-')}-${mail.id}.json`),
              JSON.stringify(mail),
            );
          for (const w of waiters.filter((x) => mail.to.includes(x.to.toLowerCase()))) {
            waiters.splice(waiters.indexOf(w), 1);
            w.resolve(mail);
          }
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const host = opts.host ?? '127.0.0.1';
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, host, () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  return {
    port,
    messages,
    async list() {
      return [...messages].reverse();
    },
    waitFor(to, timeoutMs = 5000) {
      const found = messages.find((m) => m.to.includes(to.toLowerCase()));
      if (found) return Promise.resolve(found);
      return new Promise((resolve, reject) => {
        const t = setTimeout(() => reject(new Error(`no mail to ${to} within ${timeoutMs} ms`)), timeoutMs);
        waiters.push({
          to,
          resolve: (m) => {
            clearTimeout(t);
            resolve(m);
          },
        });
      });
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
