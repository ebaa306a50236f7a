import { HttpErrorResponse } from '@angular/common/http';

import { apiErrorMessage } from '../api-error-message';
import { DEFAULT_LEVEL, MODULE_LEVELS, type ModuleLevel } from './gravity-types';

/** How many modules the screen shows first, and how many more each "Show more" adds. */
export const PAGE_SIZE = 20;

/** The most modules the screen asks for (the server's maximum is 500; one more is asked for to know if there are more). */
export const MAX_SHOWN = 499;

/** The level named in the URL, or the default for a missing or unknown one. */
export function levelFrom(value: string | null | undefined): ModuleLevel {
  return MODULE_LEVELS.find((level) => level === value) ?? DEFAULT_LEVEL;
}

/** How many modules to show for the `limit` in the URL: a whole number from 1 to MAX_SHOWN, PAGE_SIZE by default. */
export function shownFrom(value: string | null | undefined): number {
  const parsed = Number.parseInt(value ?? '', 10);
  if (!Number.isFinite(parsed) || parsed < 1) return PAGE_SIZE;
  return Math.min(parsed, MAX_SHOWN);
}

/** A reason as the server words it ("called from 3 of 3 other clusters") as a sentence. */
export function reasonSentence(reason: string): string {
  const text = reason.trim();
  if (text === '') return text;
  const sentence = text.charAt(0).toUpperCase() + text.slice(1);
  return /[.!?]$/.test(sentence) ? sentence : `${sentence}.`;
}

/** The plural noun for a level's modules ("folders"). */
export function levelNoun(level: ModuleLevel, count = 2): string {
  return count === 1 ? level : `${level}s`;
}

/** Why the ranking cannot be shown, as the screen tells it. */
export interface RankingProblem {
  /** `unavailable`: the snapshot has no ranking to show (no module map, not ready, not found); retrying will not help. */
  kind: 'unavailable' | 'failed';
  message: string;
}

/** Sorts a failed ranking request into a problem that retrying may fix or not. */
export function rankingProblem(error: unknown): RankingProblem {
  const message = apiErrorMessage(error);
  if (error instanceof HttpErrorResponse && (error.status === 404 || error.status === 409 || error.status === 400)) {
    return { kind: 'unavailable', message };
  }
  return { kind: 'failed', message };
}

