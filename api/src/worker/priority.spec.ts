import { execFileSync } from 'node:child_process';
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import * as ts from 'typescript';

describe('lowerPriority', () => {
  // In a child process, so the test runner keeps its own priority: priority.ts compiled to a
  // temporary file, then a thread started after the call reports the priority it inherited.
  let dir: string;
  beforeAll(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-priority-'));
    const source = fs.readFileSync(path.join(__dirname, 'priority.ts'), 'utf8');
    fs.writeFileSync(path.join(dir, 'priority.js'), ts.transpileModule(source, { compilerOptions: { module: ts.ModuleKind.CommonJS } }).outputText);
  });
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  const inChild = (nice: number) => JSON.parse(execFileSync(process.execPath, ['-e', `
    const { Worker } = require('node:worker_threads');
    const main = require(${JSON.stringify(path.join(dir, 'priority.js'))}).lowerPriority(${nice});
    const thread = new Worker("require('node:worker_threads').parentPort.postMessage(require('node:os').getPriority())", { eval: true });
    thread.once('message', (inThread) => { console.log(JSON.stringify({ main, inThread })); process.exit(0); });
  `], { encoding: 'utf8' }));

  it('should lower the process and the threads it starts afterwards to the nice value given', () => {
    expect(inChild(10)).toEqual({ main: 10, inThread: 10 });
  });

  it('should never raise a priority (0 leaves it as it is)', () => {
    expect(inChild(0)).toEqual({ main: os.getPriority(), inThread: os.getPriority() });
  });
});
