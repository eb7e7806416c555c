// What a download operation answers, independent of the framework: the route and the bench turn it into HTTP.

export type DownloadReply = {
  status: 200 | 206 | 302 | 304 | 416;
  headers: Record<string, string>;
  /** A stream for 200/206 bodies, a short text for 416, null otherwise (and for HEAD). */
  body: ReadableStream<Uint8Array> | string | null;
};

/** The reply as a web Response (a streamed body is handed on as is, never buffered). */
export function replyResponse(reply: DownloadReply): Response {
  return new Response(reply.body, { status: reply.status, headers: reply.headers });
}
