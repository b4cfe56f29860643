import { saveFile } from './file-download';

/** The chart's drawing size, from its viewBox: the page scales the SVG, the exported file keeps this size. */
function chartSize(element: SVGSVGElement): { width: number; height: number } {
  const { width, height } = element.viewBox.baseVal;
  return { width, height };
}

/** The chart as a standalone SVG document. */
export function svgText(element: SVGSVGElement): string {
  const { width, height } = chartSize(element);
  const copy = element.cloneNode(true) as SVGSVGElement;
  copy.setAttribute('width', String(width));
  copy.setAttribute('height', String(height));
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}`;
}

export function downloadSvg(element: SVGSVGElement, fileName: string): void {
  saveFile(new Blob([svgText(element)], { type: 'image/svg+xml' }), fileName);
}

/** Renders the SVG onto a canvas at twice its size and downloads the PNG. */
export async function downloadPng(element: SVGSVGElement, fileName: string): Promise<void> {
  const { width, height } = chartSize(element);
  const url = URL.createObjectURL(new Blob([svgText(element)], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('the chart could not be rendered as an image'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = width * 2;
    canvas.height = height * 2;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('this browser cannot draw on a canvas');
    context.scale(2, 2);
    context.drawImage(image, 0, 0, width, height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('the PNG could not be made');
    saveFile(blob, fileName);
  } finally {
    URL.revokeObjectURL(url);
  }
}
