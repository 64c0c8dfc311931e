/** Reads a picked file as text, refusing files too large to be what the import expects. */
export async function readTextFile(file: File, maxBytes: number): Promise<string> {
  if (file.size > maxBytes) {
    throw new Error(
      `${file.name} is ${(file.size / 1_048_576).toFixed(1)} MB; the import reads files up to ` +
        `${(maxBytes / 1_048_576).toFixed(0)} MB`,
    )
  }
  return file.text()
}

/** Largest diagram file read: the server accepts 5 MB request bodies. */
export const MAX_DIAGRAM_FILE_BYTES = 5 * 1_048_576
