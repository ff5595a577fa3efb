/**
 * IPC channel names, one per bridge function. Shared by the main process (handlers)
 * and the preload (the named functions on window.stressLedger). Nothing else may send
 * IPC messages.
 */
export const CHANNELS = {
  openFiles: 'bridge:open-files',
  openFolder: 'bridge:open-folder',
  saveFile: 'bridge:save-file',
  printReport: 'bridge:print-report',
  readDroppedFiles: 'bridge:read-dropped-files',
  recentFiles: 'bridge:recent-files',
  appVersion: 'bridge:app-version',
  chooseTeamFolder: 'bridge:choose-team-folder',
  connectTeamFolder: 'bridge:connect-team-folder',
  pushTeamEvents: 'bridge:push-team-events',
  readTeamChanges: 'bridge:read-team-changes',
  writeTeamRaw: 'bridge:write-team-raw',
  readTeamRaw: 'bridge:read-team-raw',
  teamFolderStatus: 'bridge:team-folder-status',
} as const;

/** Messages the main process sends to the renderer. */
export const EVENTS = {
  menuCommand: 'shell:menu-command',
  filesOpened: 'shell:files-opened',
  teamFolderChanged: 'shell:team-folder-changed',
} as const;

export type InvokeChannel = (typeof CHANNELS)[keyof typeof CHANNELS];
