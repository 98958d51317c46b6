/**
 * Requests Node's HTTP parser refuses before Express sees them — headers over the size limit, bytes
 * that are not HTTP — still get a problem document (RFC 9457), with 431 Request Header Fields Too
 * Large (RFC 6585 §5) or 400, instead of a bare status line.
 */
import type { Server } from "node:http";
import type { Duplex } from "node:stream";

export function answerClientErrors(server: Server): void {
  server.on("clientError", (err: NodeJS.ErrnoException, socket: Duplex) => {
    if (err.code === "ECONNRESET" || !socket.writable) return void socket.destroy();
    const tooLarge = err.code === "HPE_HEADER_OVERFLOW";
    const status = tooLarge ? 431 : 400;
    const title = tooLarge ? "Request Header Fields Too Large" : "Bad Request";
    const detail = tooLarge
      ? "The request's headers are larger than the server accepts; send fewer or shorter cookies and headers."
      : "The request could not be read as HTTP.";
    const body = JSON.stringify({ type: "about:blank", title, status, detail });
    socket.end(
      `HTTP/1.1 ${status} ${title}\r\nContent-Type: application/problem+json\r\nContent-Length: ${Buffer.byteLength(body)}\r\nConnection: close\r\n\r\n${body}`,
    );
  });
}
