// Serves a built web app from another folder and passes /api to a running API, so a screen in
// the works can be tried against `npm start`'s data without replacing the app it serves.
//   node scripts/dev-web-proxy.mjs <browser-folder> <port> [api-url]
// Sign in once at the API's own address first: the session cookie belongs to 127.0.0.1, any port.
import * as fs from 'node:fs';
import * as http from 'node:http';
import * as path from 'node:path';

const [folder, port = '4400', api = 'http://127.0.0.1:4300'] = process.argv.slice(2);
if (!folder || !fs.existsSync(path.join(folder, 'index.html'))) {
  console.error('usage: node scripts/dev-web-proxy.mjs <built browser folder with index.html> <port> [api-url]');
  process.exit(2);
}
const root = path.resolve(folder);
const TYPES = { '.html': 'text/html', '.js': 'text/javascript', '.css': 'text/css', '.woff2': 'font/woff2', '.svg': 'image/svg+xml', '.png': 'image/png', '.ico': 'image/x-icon', '.json': 'application/json' };

http.createServer((req, res) => {
  if (req.url.startsWith('/api/')) {
    const target = new URL(req.url, api);
    const upstream = http.request(target, { method: req.method, headers: { ...req.headers, host: target.host } }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on('error', (err) => { res.writeHead(502, { 'content-type': 'text/plain' }); res.end(`API not reachable at ${api}: ${err.message}`); });
    req.pipe(upstream);
    return;
  }
  const wanted = path.join(root, decodeURIComponent(new URL(req.url, 'http://x').pathname));
  const file = wanted.startsWith(root) && fs.existsSync(wanted) && fs.statSync(wanted).isFile() ? wanted : path.join(root, 'index.html');
  res.writeHead(200, { 'content-type': TYPES[path.extname(file)] ?? 'application/octet-stream' });
  fs.createReadStream(file).pipe(res);
}).listen(Number(port), '127.0.0.1', () => console.log(`web from ${root} on http://127.0.0.1:${port} (API ${api})`));
