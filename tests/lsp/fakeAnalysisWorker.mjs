// A stand-in for server/dist/worker.js in tests of the worker client's safety net. Each line of a job's text
// `kernel <name> <hash>` is one kernel: it is reported as started unless its hash is in the job's stopped set;
// a kernel named `hang` never finishes, one named `exit` ends the worker. The answer lists the kernels analysed
// and the stopped ones, so a test sees what each attempt did. The cancellation flag is not read (so a job cancelled
// before it started still runs, as one cancelled in the middle of a stuck kernel would).
import { parentPort } from 'node:worker_threads';

const port = parentPort;
port.on('message', (message) => {
  if (message.type !== 'analyze') return;
  const analysed = [];
  const stopped = [];
  for (const line of message.text.split('\n')) {
    const [word, name, hash] = line.split(' ');
    if (word !== 'kernel') continue;
    if (message.stopped.has(hash)) {
      stopped.push(`${name}:${message.stopped.get(hash).kind}`);
      continue;
    }
    port.postMessage({ type: 'kernel', id: message.id, name, hash });
    if (name === 'hang') for (;;);
    if (name === 'exit') process.exit(3);
    analysed.push(name);
  }
  const diagnostics = [...analysed.map((n) => `analysed ${n}`), ...stopped.map((s) => `stopped ${s}`)];
  port.postMessage({ type: 'done', id: message.id, diagnostics, kernels: [], elapsedMs: 0 });
});
port.postMessage({ type: 'ready' });
