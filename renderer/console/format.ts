/** Number formats shared by the console's screens. */
export const formatCount = (n: number): string => n.toLocaleString('en-GB');

export function formatRate(hz: number): string {
  if (hz >= 1e6) return `${(hz / 1e6).toFixed(2)} M events/s`;
  if (hz >= 1e3) return `${(hz / 1e3).toFixed(1)} k events/s`;
  return `${hz.toFixed(0)} events/s`;
}

export function formatDuration(seconds: number): string {
  if (seconds < 1) return `${(seconds * 1000).toFixed(0)} ms`;
  if (seconds < 120) return `${seconds.toFixed(2)} s`;
  return `${Math.floor(seconds / 60)} min ${(seconds % 60).toFixed(0)} s`;
}

export function formatBytes(bytes: number): string {
  if (bytes >= 2 ** 30) return `${(bytes / 2 ** 30).toFixed(1)} GiB`;
  if (bytes >= 2 ** 20) return `${(bytes / 2 ** 20).toFixed(1)} MiB`;
  if (bytes >= 2 ** 10) return `${(bytes / 2 ** 10).toFixed(0)} KiB`;
  return `${bytes} B`;
}
