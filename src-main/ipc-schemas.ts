import { z } from 'zod';
import { CHANNELS } from './channels';
import { validateEventShape } from '../src-renderer/archive/journal/validate';

/**
 * The payload every IPC handler accepts, validated in the main process before anything
 * is done with it (the renderer is treated as untrusted input).
 */

/** Largest file the shell reads or writes for the renderer, bytes (512 MiB). */
export const MAXIMUM_FILE_BYTES = 512 * 1024 * 1024;
/** Most files one open or drop may deliver. */
export const MAXIMUM_FILES = 5000;

/** A file name to suggest in a save dialog: no folders, no control characters, not "." or "..". */
export const suggestedFileName = z.string()
  .min(1).max(255)
  // eslint-disable-next-line no-control-regex
  .refine((name) => !/[\u0000-\u001f\u007f/\\]/.test(name), 'a file name without folders or control characters')
  .refine((name) => name !== '.' && name !== '..', 'a file name, not "." or ".."');

const extension = z.string().regex(/^\.?[A-Za-z0-9]{1,10}$/, 'a file extension such as ".csv"');

export const openFilesPayload = z.object({
  accept: z.array(extension).max(32).optional(),
  multiple: z.boolean().optional(),
}).strict().optional();

export const openFolderPayload = z.undefined();

export const saveFilePayload = z.object({
  suggestedName: suggestedFileName,
  bytes: z.instanceof(Uint8Array).refine((b) => b.byteLength <= MAXIMUM_FILE_BYTES, `at most ${MAXIMUM_FILE_BYTES} bytes`),
  mimeType: z.string().regex(/^[a-z0-9!#$&^_.+-]+\/[a-z0-9!#$&^_.+-]+(;\s?[a-z0-9-]+=[a-z0-9-]+)?$/i, 'a MIME type such as "text/csv"'),
}).strict();

export const printReportPayload = z.object({
  suggestedName: suggestedFileName.refine((n) => /\.pdf$/i.test(n), 'a name ending in .pdf'),
}).strict();

/** Absolute paths of files the user dropped on the window (read by the preload from the drop event). */
export const readDroppedFilesPayload = z.object({
  paths: z.array(z.string().min(1).max(4096).refine((p) => !p.includes('\u0000'), 'a path without NUL')
    .refine((p) => p.startsWith('/') || /^[A-Za-z]:[\\/]/.test(p) || p.startsWith('\\\\'), 'an absolute path'))
    .min(1).max(MAXIMUM_FILES),
}).strict();

export const noPayload = z.undefined();

/** Most events one push may carry. */
export const MAXIMUM_PUSHED_EVENTS = 200_000;

const absolutePath = z.string().min(1).max(4096).refine((p) => !p.includes('\u0000'), 'a path without NUL')
  .refine((p) => p.startsWith('/') || /^[A-Za-z]:[\\/]/.test(p) || p.startsWith('\\\\'), 'an absolute path');

/** A user name or device id as the journal names them: trimmed, printable, short. */
const journalName = z.string().min(1).max(200)
  // eslint-disable-next-line no-control-regex
  .refine((v) => v.trim() === v && !/[\u0000-\u001f\u007f]/.test(v), 'a name without control characters or outer spaces');

const sha256Hash = z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 hash (64 lower-case hex digits)');

export const connectTeamFolderPayload = z.object({ folder: absolutePath, author: journalName, device: journalName }).strict();

/** Events to write: each must have the review log's shape (archive/journal/validate.ts). */
export const pushTeamEventsPayload = z.object({
  events: z.array(z.unknown()).max(MAXIMUM_PUSHED_EVENTS).superRefine((events, context) => {
    for (let i = 0; i < events.length; i++) {
      const problem = validateEventShape(events[i]);
      if (problem) { context.addIssue({ code: 'custom', path: [i], message: `not a review-log event (${problem})` }); return; }
    }
  }),
}).strict();

export const writeTeamRawPayload = z.object({
  hash: sha256Hash,
  bytes: z.instanceof(Uint8Array).refine((b) => b.byteLength <= MAXIMUM_FILE_BYTES, `at most ${MAXIMUM_FILE_BYTES} bytes`),
}).strict();

export const readTeamRawPayload = z.object({ hash: sha256Hash }).strict();

/** Schema of each invoke channel's payload. */
export const PAYLOAD_SCHEMAS = {
  [CHANNELS.openFiles]: openFilesPayload,
  [CHANNELS.openFolder]: openFolderPayload,
  [CHANNELS.saveFile]: saveFilePayload,
  [CHANNELS.printReport]: printReportPayload,
  [CHANNELS.readDroppedFiles]: readDroppedFilesPayload,
  [CHANNELS.recentFiles]: noPayload,
  [CHANNELS.appVersion]: noPayload,
  [CHANNELS.chooseTeamFolder]: noPayload,
  [CHANNELS.connectTeamFolder]: connectTeamFolderPayload,
  [CHANNELS.pushTeamEvents]: pushTeamEventsPayload,
  [CHANNELS.readTeamChanges]: noPayload,
  [CHANNELS.writeTeamRaw]: writeTeamRawPayload,
  [CHANNELS.readTeamRaw]: readTeamRawPayload,
  [CHANNELS.teamFolderStatus]: noPayload,
} as const;

export type PayloadOf<C extends keyof typeof PAYLOAD_SCHEMAS> = z.infer<(typeof PAYLOAD_SCHEMAS)[C]>;

/** Validate a payload; throws an Error naming the channel and the first problem. */
export function parsePayload<C extends keyof typeof PAYLOAD_SCHEMAS>(channel: C, payload: unknown): PayloadOf<C> {
  const result = PAYLOAD_SCHEMAS[channel].safeParse(payload);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new Error(`Refused ${channel}: ${issue.path.join('.') || 'payload'}: ${issue.message}`);
  }
  return result.data as PayloadOf<C>;
}
