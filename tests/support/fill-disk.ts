import fs from 'node:fs';

/**
 * Writes a filler file until its file system answers ENOSPC (big chunks first, then single bytes) and
 * returns the bytes written: the disk is then full. Truncate the file to give some room back.
 */
export function fillDisk(file: string): number {
  const fd = fs.openSync(file, 'w');
  let written = 0;
  try {
    for (const size of [1 << 20, 1 << 16, 1 << 12, 1]) {
      const chunk = Buffer.alloc(size, 0x5a);
      for (;;) {
        try {
          written += fs.writeSync(fd, chunk);
        } catch (err) {
          if ((err as NodeJS.ErrnoException).code !== 'ENOSPC') throw err;
          break;
        }
      }
    }
  } finally {
    fs.closeSync(fd);
  }
  return written;
}
