/** Saves a blob as a file through a temporary link (the PDF report, any binary download). */
export function downloadBlob(blob: Blob, fileName: string) {
  const url = URL.createObjectURL(blob)
  const link = document.createElement('a')
  link.href = url
  link.download = fileName
  link.style.display = 'none'
  document.body.appendChild(link)
  link.click()
  link.remove()
  // Revoke after the click has been handled; revoking at once can cancel the download.
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}
