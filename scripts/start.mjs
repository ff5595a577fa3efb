// npm start: the desktop app when the Electron runtime is installed; otherwise the same app
// as a web page on http://127.0.0.1:5199 (the demo archive is written on first run either way).
import net from 'node:net';
import { electronBinary, run } from './electron-runtime.mjs';

/** Whether something already listens on 127.0.0.1:port. */
function portInUse(port) {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.once('connect', () => { socket.destroy(); resolve(true); });
    socket.once('error', () => resolve(false));
  });
}

const root = process.cwd();
const binary = electronBinary(root);

if (binary) {
  console.log('Building Stress Ledger (Electron)…');
  const built = await run('npx', ['electron-vite', 'build']);
  if (built !== 0) process.exit(built);
  process.exit(await run(binary, ['.'], { env: { ...process.env, NODE_ENV: 'production' } }));
} else {
  console.log([
    '',
    'The Electron runtime is not installed on this machine (node_modules/electron has no binary),',
    'so the desktop window cannot open here. Serving the same app in the browser instead:',
    '',
    '    http://127.0.0.1:5199',
    '',
    'On first run it writes the demo archive of the Harrow Flats field. Press Ctrl+C to stop.',
    '',
  ].join('\n'));
  const built = await run('npx', ['vite', 'build', '--config', 'vite.web.config.ts']);
  if (built !== 0) process.exit(built);
  if (await portInUse(5199)) {
    console.error('Port 5199 is already in use: another server (perhaps an earlier `npm start` or `npm run web`) is running.\nOpen http://127.0.0.1:5199 (it serves the build just made), or stop that server and run `npm start` again.');
    process.exit(1);
  }
  process.exit(await run('npx', ['vite', 'preview', '--config', 'vite.web.config.ts', '--host', '127.0.0.1', '--port', '5199', '--strictPort']));
}
