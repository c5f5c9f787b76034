import type { Request } from 'express';

/**
 * The origin links in e-mail point at: PUBLIC_URL when set (production refuses to start
 * without it), else the address this server was reached on as its own socket sees it. Never
 * the request's Host or X-Forwarded-Host header: those are the sender's to choose.
 */
export function publicOrigin(publicUrl: string | undefined, req: Request): string {
  if (publicUrl) return publicUrl.replace(/\/+$/, '');
  return listeningOrigin(req.socket.localAddress, req.socket.localPort);
}

/** `http://host:port` of the server's own end of a connection (loopback reads as localhost). */
export function listeningOrigin(address: string | undefined, port: number | undefined): string {
  const host = (address ?? '').replace(/^::ffff:/, '');
  const name =
    host === '' || host === '::1' || /^127\./.test(host)
      ? 'localhost'
      : host.includes(':')
        ? `[${host}]`
        : host;
  return `http://${name}${port ? `:${port}` : ''}`;
}
