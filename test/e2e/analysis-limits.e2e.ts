/**
 * The per-job limits, on the compiled worker code `npm test` built (the analysis runs in its own
 * thread only there): a job over its heap limit or its time limit fails with that reason, and
 * the worker's thread carries on.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { buildDemoZip } from '../../api/src/demo/demo-zip';
import { DEFAULT_SETTINGS } from '../../api/src/analyzer-lib';
import { DEFAULT_UPLOAD_LIMITS } from '../../api/src/uploads/upload-limits';
import type * as RunAnalysis from '../../api/src/worker/run-analysis';
import type { AnalysisRequest } from '../../api/src/worker/analysis-request';

// The compiled module, so the analysis thread script sits beside it.
const compiled = path.join(__dirname, '../../dist/test-server/api/src/worker/run-analysis.js');
const { runAnalysis } = require(compiled) as typeof RunAnalysis;

describe('the limits of one analysis', () => {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'seamline-limits-'));
  const zip = path.join(tmp, 'before.zip');
  const request = (name: string): AnalysisRequest => ({
    snapshotId: name, source: 'upload', inputFile: zip, workDir: path.join(tmp, name),
    settings: { ...DEFAULT_SETTINGS }, uploadLimits: DEFAULT_UPLOAD_LIMITS,
  });

  beforeAll(() => buildDemoZip('before', zip));
  afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

  it('should stop an analysis over its memory limit and say so', async () => {
    await expect(runAnalysis(request('oom'), { timeoutSeconds: 120, memoryMb: 16 }, () => undefined))
      .rejects.toMatchObject({ failure: { kind: 'limit', message: expect.stringMatching(/more memory than its limit of 16 MB/) } });
    expect(fs.existsSync(path.join(tmp, 'oom'))).toBe(false);
  }, 120_000);

  it('should stop an analysis over its time limit and say so', async () => {
    await expect(runAnalysis(request('slow'), { timeoutSeconds: 0.2, memoryMb: 2048 }, () => undefined))
      .rejects.toMatchObject({ failure: { kind: 'limit', message: expect.stringMatching(/took longer than its limit/) } });
  }, 60_000);

  it('should analyse within generous limits, reporting progress in order', async () => {
    const phases: string[] = [];
    const snapshot = await runAnalysis(request('fine'), { timeoutSeconds: 120, memoryMb: 2048 }, (p) => phases.push(p.phase));
    expect(snapshot.functions.length).toBeGreaterThan(100);
    expect(phases[0]).toBe('extract');
    expect(phases).toContain('analyse');
    expect(fs.existsSync(path.join(tmp, 'fine'))).toBe(false);
  }, 120_000);
});
