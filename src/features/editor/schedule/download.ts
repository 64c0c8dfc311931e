/** Saves text as a file through a temporary link: no server round trip, works offline. */
export function downloadText(text: string, fileName: string, type = 'text/csv;charset=utf-8') {
  const url = URL.createObjectURL(new Blob([text], { type }))
  const link = document.createElement('a')
  link.href = url
  link.download = fileName
  link.style.display = 'none'
  document.body.appendChild(link)
  link.click()
  link.remove()
  // Revoke after the click has been handled; revoking at once can cancel the download in Firefox.
  setTimeout(() => URL.revokeObjectURL(url), 0)
}
