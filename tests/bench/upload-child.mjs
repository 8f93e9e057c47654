/**
 * The evidence upload bench's client, in a process of its own (so the server's memory and CPU are
 * measured alone). On each IPC message { port, cookie, filingId, tag, bytes } it POSTs a
 * multipart body of `bytes` CSV-like text, generated as it is sent from one 1 MB chunk (nothing
 * held), and answers { status, ms, body } with ms from the first byte sent to the answer's end.
 */
import http from 'node:http';

const CHUNK = 1024 * 1024;

function upload({ port, cookie, filingId, tag, bytes }) {
  return new Promise((resolve, reject) => {
    const boundary = 'fieldfile-bench';
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="category"\r\n\r\nother\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big-${tag}.csv"\r\nContent-Type: text/csv\r\n\r\n`,
    );
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const t0 = process.hrtime.bigint();
    const req = http.request(
      {
        port,
        host: '127.0.0.1',
        method: 'POST',
        path: `/api/filings/${filingId}/evidence`,
        headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': head.length + bytes + tail.length },
      },
      (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (d) => (body += d));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, ms: Number(process.hrtime.bigint() - t0) / 1e6, body: body.slice(0, 300) }));
      },
    );
    req.on('error', reject);
    const chunk = Buffer.alloc(CHUNK, `${tag},1.19,W/kg\n`);
    let sent = 0;
    req.write(head);
    const pump = () => {
      while (sent < bytes) {
        const n = Math.min(CHUNK, bytes - sent);
        sent += n;
        if (!req.write(n === CHUNK ? chunk : chunk.subarray(0, n))) return void req.once('drain', pump);
      }
      req.end(tail);
    };
    pump();
  });
}

process.on('message', (job) => {
  upload(job).then(
    (result) => process.send(result),
    (err) => process.send({ status: 0, ms: 0, body: String(err) }),
  );
});
process.on('disconnect', () => process.exit(0));
