// Types for the ES build of maxrects-packer, imported by its file path (see pack-sheets.ts).
declare module 'maxrects-packer/dist/maxrects-packer.mjs' {
  export * from 'maxrects-packer/dist/index';
}
