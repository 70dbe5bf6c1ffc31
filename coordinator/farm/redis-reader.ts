/**
 * A small Redis client for the read-only commands (`tendril status`, `list`,
 * `watch`): one connection speaking RESP2, commands pipelined in order,
 * AUTH and SELECT from the URL, TLS for rediss:// URLs. It exists for
 * start-up time: loading ioredis costs about as much as the rest of
 * `tendril status` together (scripts/measure-startup.mjs); everything that
 * writes, queues or needs reconnection uses ioredis.
 *
 * URL: redis[s]://[[user]:password@]host[:port][/db]; user and password
 * percent-decoded, as ioredis reads them.
 */
import { connect as netConnect, isIP, type Socket } from 'node:net';
import { connect as tlsConnect } from 'node:tls';
import type { StoreReads } from './ensemble-reader.js';

type Reply = string | Buffer | number | null | Reply[];

interface Pending {
  /** Bulk strings as bytes (HGETALL of protobuf values). */
  raw: boolean;
  resolve: (r: Reply) => void;
  reject: (e: Error) => void;
}

/** Parse one RESP2 reply of `buf` from `at`; undefined while incomplete. */
function parseReply(buf: Buffer, at: number, raw: boolean): { value: Reply | Error; next: number } | undefined {
  const eol = buf.indexOf('\r\n', at);
  if (eol < 0) return undefined;
  const type = String.fromCharCode(buf[at]);
  const line = buf.toString('utf8', at + 1, eol);
  const after = eol + 2;
  switch (type) {
    case '+':
      return { value: line, next: after };
    case '-':
      // the server's error reply (WRONGPASS, NOAUTH, WRONGTYPE...), relayed as ioredis relays it
      return { value: new Error(line), next: after };
    case ':':
      return { value: Number(line), next: after };
    case '$': {
      const n = Number(line);
      if (n < 0) return { value: null, next: after };
      if (buf.length < after + n + 2) return undefined;
      return { value: raw ? Buffer.from(buf.subarray(after, after + n)) : buf.toString('utf8', after, after + n), next: after + n + 2 };
    }
    case '*': {
      const n = Number(line);
      if (n < 0) return { value: null, next: after };
      const items: Reply[] = [];
      let next = after;
      for (let i = 0; i < n; i++) {
        const item = parseReply(buf, next, raw);
        if (!item) return undefined;
        if (item.value instanceof Error) return { value: item.value, next: item.next };
        items.push(item.value);
        next = item.next;
      }
      return { value: items, next };
    }
    default:
      throw new Error(`unexpected Redis reply type "${type}"`);
  }
}

function encodeCommand(args: string[]): Buffer {
  const parts = [`*${args.length}\r\n`];
  for (const a of args) parts.push(`$${Buffer.byteLength(a)}\r\n${a}\r\n`);
  return Buffer.from(parts.join(''));
}

export class RedisReader implements StoreReads {
  private pending: Pending[] = [];
  private buf: Buffer = Buffer.alloc(0);
  private failure: Error | null = null;

  private constructor(private readonly socket: Socket) {
    socket.on('data', (chunk: Buffer) => this.onData(chunk));
    socket.on('error', (err) => this.failAll(err));
    socket.on('close', () => this.failAll(new Error('Connection is closed')));
  }

  /** Connect, authenticate and select the URL's database; rejects with the server's or the socket's error. */
  static async open(url: string, timeoutMs = 5000): Promise<RedisReader> {
    const u = new URL(url);
    const host = u.hostname.replace(/^\[(.*)\]$/, '$1');
    const port = u.port ? Number(u.port) : 6379;
    const socket = await new Promise<Socket>((resolve, reject) => {
      const s: Socket =
        u.protocol === 'rediss:'
          ? tlsConnect({ host, port, servername: isIP(host) ? undefined : host }, () => resolve(s))
          : netConnect({ host, port }, () => resolve(s));
      s.once('error', reject);
      s.setTimeout(timeoutMs, () => {
        s.destroy();
        reject(new Error(`no answer within ${timeoutMs / 1000} s`));
      });
    });
    socket.setTimeout(0);
    socket.removeAllListeners('error');
    const reader = new RedisReader(socket);
    try {
      const user = decodeURIComponent(u.username);
      const password = decodeURIComponent(u.password);
      if (password) await (user ? reader.command('AUTH', user, password) : reader.command('AUTH', password));
      const db = u.pathname.replace(/^\//, '');
      if (db && db !== '0') await reader.command('SELECT', db);
      return reader;
    } catch (err) {
      reader.close();
      throw err;
    }
  }

  command(...args: string[]): Promise<Reply> {
    return this.send(false, args);
  }

  private send(raw: boolean, args: string[]): Promise<Reply> {
    if (this.failure) return Promise.reject(this.failure);
    return new Promise<Reply>((resolve, reject) => {
      this.pending.push({ raw, resolve, reject });
      this.socket.write(encodeCommand(args));
    });
  }

  /** HGETALL with the values as bytes (field names decoded). */
  async hgetallBuffer(key: string): Promise<Record<string, Buffer>> {
    const flat = (await this.send(true, ['HGETALL', key])) as Buffer[];
    const out: Record<string, Buffer> = {};
    for (let i = 0; i + 1 < flat.length; i += 2) out[flat[i].toString('utf8')] = flat[i + 1];
    return out;
  }

  async hgetall(key: string): Promise<Record<string, string>> {
    const flat = (await this.command('HGETALL', key)) as string[];
    const out: Record<string, string> = {};
    for (let i = 0; i + 1 < flat.length; i += 2) out[flat[i]] = flat[i + 1];
    return out;
  }

  async hlen(key: string): Promise<number> {
    return (await this.command('HLEN', key)) as number;
  }

  async hmget(key: string, ...fields: string[]): Promise<Array<string | null>> {
    return (await this.command('HMGET', key, ...fields)) as Array<string | null>;
  }

  async zrevrange(key: string, start: number, stop: number): Promise<string[]> {
    return (await this.command('ZREVRANGE', key, String(start), String(stop))) as string[];
  }

  close(): void {
    this.failure ??= new Error('Connection is closed');
    this.socket.destroy();
  }

  private onData(chunk: Buffer): void {
    this.buf = this.buf.length === 0 ? chunk : Buffer.concat([this.buf, chunk]);
    let at = 0;
    for (;;) {
      let r: ReturnType<typeof parseReply>;
      try {
        r = at < this.buf.length ? parseReply(this.buf, at, this.pending[0]?.raw ?? false) : undefined;
      } catch (err) {
        this.failAll(err as Error);
        this.socket.destroy();
        return;
      }
      if (!r) break;
      at = r.next;
      const p = this.pending.shift();
      if (!p) continue;
      if (r.value instanceof Error) p.reject(r.value);
      else p.resolve(r.value);
    }
    this.buf = at >= this.buf.length ? Buffer.alloc(0) : this.buf.subarray(at);
  }

  private failAll(err: Error): void {
    this.failure ??= err;
    for (const p of this.pending.splice(0)) p.reject(err);
  }
}
