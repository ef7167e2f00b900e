// A customer's signature arrives as an SVG document written by a phone. It is shown only as an
// <img> source: an image-loaded SVG runs no script and loads nothing else, so a hostile
// document cannot reach the page (it is never put into the DOM as markup).
export function signatureDataUrl(svg: string): string {
  return `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
}
