/**
 * The load benchmark's proxy, in its own process so its CPU is not the load generator's: each
 * request goes to the next upstream in turn (UPSTREAMS=port,port), over kept-alive connections,
 * whatever its cookie says. Prints "proxy ready" when listening on PORT.
 */
import http from 'node:http';

const targets = (process.env.UPSTREAMS ?? '').split(',').map(Number).filter(Boolean);
if (!targets.length) throw new Error('UPSTREAMS must name at least one port');
const agent = new http.Agent({ keepAlive: true, maxSockets: 128 });
let next = 0;

const server = http.createServer((req, res) => {
  const port = targets[next++ % targets.length];
  const upstream = http.request({ host: '127.0.0.1', port, method: req.method, path: req.url, headers: req.headers, agent }, (answer) => {
    res.writeHead(answer.statusCode ?? 502, answer.headers);
    answer.pipe(res);
  });
  upstream.on('error', () => {
    if (!res.headersSent) res.writeHead(502);
    res.end();
  });
  req.pipe(upstream);
});
server.keepAliveTimeout = 30_000;
server.listen(Number(process.env.PORT), '127.0.0.1', () => console.log('proxy ready'));
