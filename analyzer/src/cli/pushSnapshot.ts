/**
 * `seamline push`
 * ===============
 * Uploads a snapshot file to a Seamline server for a codebase, authenticated by a workspace API
 * token. The file is read and validated first, exactly as `check` does, so a broken file fails
 * the pipeline here with the file's own problems and nothing is sent. The upload itself streams
 * the file from disk. On success one line goes to stdout; with `--wait` the command then follows
 * the server's analysis and exits 0 when it is ready, 1 when it failed.
 */
import { promises as fsp } from 'node:fs';
import path from 'node:path';
import { parseSnapshot } from '../snapshot/parseSnapshot';
import { SnapshotInputError } from '../snapshot/SnapshotInputError';
import { CliInputError } from './CliInputError';
import { acceptedSnapshot } from './pushAnswers';
import type { PushCommand } from './pushCommandLine';
import { pushUrl, sendsTokenInClear, snapshotUrl } from './pushEndpoints';
import { exchange } from './pushHttp';
import { DEFAULT_PUSH_TIMING, waitForAnalysis } from './pushWait';
import type { PushTiming } from './pushWait';
import { readInputFile } from './readInputFile';
import type { CommandIo } from './runScan';

// Validates the snapshot and returns its size; the text is dropped before the upload streams the file.
async function checkSnapshotFile(file: string, shownAs: string): Promise<number> {
  const text = await readInputFile(file, 'snapshot', shownAs);
  try {
    parseSnapshot(text, shownAs);
  } catch (error) {
    if (error instanceof SnapshotInputError) throw new CliInputError(`${error.reason}\nNothing was sent to the server.`);
    throw error;
  }
  return (await fsp.stat(file)).size;
}

/** Run `seamline push`; returns 0 (pushed; with --wait: analysed) or 1 (--wait: the analysis failed). */
export async function runPush(command: PushCommand, io: CommandIo, timing: PushTiming = DEFAULT_PUSH_TIMING): Promise<number> {
  const file = path.resolve(io.cwd, command.snapshot);
  const size = await checkSnapshotFile(file, command.snapshot);
  if (sendsTokenInClear(command.server)) {
    io.stderr.write(`seamline push: warning: ${command.server} is plain http, so the token crosses the network unencrypted; use https:// where you can\n`);
  }
  const answer = await exchange({
    method: 'POST',
    url: pushUrl(command),
    headers: {
      Authorization: `Bearer ${command.token}`,
      'Content-Type': 'application/json',
      Accept: 'application/json',
    },
    bodyFile: { path: file, size },
    idleTimeoutMs: timing.idleTimeoutMs,
    server: command.server,
  });
  const snapshot = acceptedSnapshot(answer, command.server);
  const statusUrl = snapshotUrl(command.server, snapshot.id);
  io.stdout.write(`Pushed snapshot ${snapshot.id} to codebase ${JSON.stringify(command.codebase)} (${snapshot.status}): ${statusUrl}\n`);
  if (!command.wait) return 0;

  const final = await waitForAnalysis(
    { server: command.server, token: command.token, url: statusUrl, id: snapshot.id, timeoutSeconds: command.timeoutSeconds, stderr: io.stderr },
    timing,
  );
  if (final.status === 'failed') {
    io.stderr.write(`seamline push: the server could not analyse snapshot ${snapshot.id}: ${final.error ?? 'it gave no reason'}\n`);
    return 1;
  }
  io.stdout.write(`Snapshot ${snapshot.id} is ready: ${statusUrl}\n`);
  return 0;
}
