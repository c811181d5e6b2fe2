/** Hand the browser a text file to save, without a round trip to the server. */
export function downloadText(fileName: string, text: string, type = 'text/csv;charset=utf-8'): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  // Give the download a moment to start before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}
