import { z } from 'zod';

/** The host-side file chooser: large recordings are picked on the host and never travel through the page. */
export const listDirectoryRequest = z.object({ path: z.string().nullable() }).strict();

export const directoryEntry = z.object({
  name: z.string(),
  kind: z.enum(['directory', 'file']),
  sizeBytes: z.number().nonnegative(),
  /** True for files Gazeloom can import (.glev, .csv, .txt). */
  importable: z.boolean(),
});

export const directoryListing = z.object({
  path: z.string(),
  parent: z.string().nullable(),
  entries: z.array(directoryEntry),
  /** Useful starting points: the home folder, the data folder's stimuli. */
  places: z.array(z.object({ label: z.string(), path: z.string() })),
});

export type DirectoryListing = z.infer<typeof directoryListing>;
