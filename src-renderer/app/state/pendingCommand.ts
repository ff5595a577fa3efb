import type { MenuCommand } from '../../bridge/types';

/** A menu command given on another screen, kept until the screen that handles it opens. */
let pending: MenuCommand | null = null;

export function setPendingCommand(command: MenuCommand): void { pending = command; }

export function takePendingCommand(): MenuCommand | null {
  const c = pending;
  pending = null;
  return c;
}
