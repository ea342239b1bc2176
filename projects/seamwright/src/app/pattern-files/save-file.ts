/**
 * Hands a file made in the browser to the user as a download named `fileName`: a link to an object URL,
 * clicked once. The URL is released after the click has been handled.
 */
export function saveFile(data: Blob, fileName: string, doc: Document = document): void {
  const url = URL.createObjectURL(data);
  const link = doc.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  link.style.display = 'none';
  doc.body.appendChild(link);
  link.click();
  link.remove();
  // Revoking at once can cancel the download in some browsers; a turn of the event loop is enough.
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
