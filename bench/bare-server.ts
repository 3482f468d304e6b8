/** The comparison for the load benchmark: Express returning fixed JSON bodies, nothing else. */
import fs from 'node:fs';
import express from 'express';

const bodies = JSON.parse(fs.readFileSync(process.env.BARE_BODIES!, 'utf8')) as Record<string, unknown>;
const app = express();
app.disable('x-powered-by');
for (const [path, body] of Object.entries(bodies)) app.get(path, (_req, res) => void res.json(body));
app.listen(Number(process.env.PORT), '127.0.0.1', () => console.log('bare server ready'));
