import type { IpcMain, IpcMainInvokeEvent } from 'electron';
import { fail } from '../contract/result';
import type { HostConnection } from '../host/create-host';
import type { HostLog } from '../host/log';
import { isTrustedFrame } from './security';

/**
 * The only code that touches ipcMain. One handler per contract channel (unknown channels
 * have no handler at all); each call is refused unless it comes from one of the app's own
 * frames in a window the host knows, and the dispatcher validates every payload.
 */
export function registerContractIpc(
  ipcMain: Pick<IpcMain, 'handle'>,
  channelNames: readonly string[],
  connectionFor: (senderId: number) => HostConnection | undefined,
  log: HostLog,
): void {
  for (const channel of channelNames) {
    ipcMain.handle(channel, async (event: IpcMainInvokeEvent, payload: unknown) => {
      const frameUrl = event.senderFrame?.url ?? null;
      if (!isTrustedFrame(event.senderFrame)) {
        log.warn('security.untrusted_sender', { channel, frameUrl });
        return fail('untrusted_sender', `${channel}: refused a message from ${frameUrl ?? 'an unknown frame'}`);
      }
      const connection = connectionFor(event.sender.id);
      if (!connection) {
        log.warn('security.unknown_window', { channel, senderId: event.sender.id });
        return fail('untrusted_sender', `${channel}: refused a message from a window the host did not open`);
      }
      return connection.dispatch(channel, payload);
    });
  }
}
