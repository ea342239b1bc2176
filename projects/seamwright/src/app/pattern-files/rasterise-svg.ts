/** Pixels per inch of exported pictures: the CSS inch, so the picture matches the board at 100 %. */
export const PNG_PX_PER_IN = 96;
/** Largest side and area of an exported picture; browsers refuse canvases much larger than this. */
export const PNG_MAX_SIDE_PX = 8192;
export const PNG_MAX_AREA_PX = 32_000_000;

/** Size of the picture of a `widthIn` × `heightIn` drawing: 96 px per inch, scaled down to fit the limits. */
export function pngSize(widthIn: number, heightIn: number): { widthPx: number; heightPx: number; pxPerIn: number } {
  let pxPerIn = PNG_PX_PER_IN;
  pxPerIn = Math.min(pxPerIn, PNG_MAX_SIDE_PX / Math.max(widthIn, heightIn));
  pxPerIn = Math.min(pxPerIn, Math.sqrt(PNG_MAX_AREA_PX / (widthIn * heightIn)));
  return {
    widthPx: Math.max(1, Math.floor(widthIn * pxPerIn)),
    heightPx: Math.max(1, Math.floor(heightIn * pxPerIn)),
    pxPerIn,
  };
}

/**
 * Draws an SVG file (text) into a canvas of the given size and answers it as a PNG. Runs in the
 * browser: the SVG is loaded as an image from an object URL (the app's content policy allows blob:
 * images).
 */
export async function rasteriseSvg(svg: string, widthPx: number, heightPx: number): Promise<Blob> {
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.decoding = 'async';
    const loaded = new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The picture could not be drawn'));
    });
    image.src = url;
    await loaded;
    const canvas = document.createElement('canvas');
    canvas.width = widthPx;
    canvas.height = heightPx;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw pictures');
    context.drawImage(image, 0, 0, widthPx, heightPx);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error('The picture is too large for this browser'))), 'image/png'),
    );
  } finally {
    URL.revokeObjectURL(url);
  }
}
