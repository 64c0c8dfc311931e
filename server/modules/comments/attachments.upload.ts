import type { RequestHandler } from 'express'
import multer from 'multer'
import { COMMENT_LIMITS } from '../../../shared/api/comments.ts'
import { badRequest, HttpError } from '../../errors.ts'

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: COMMENT_LIMITS.attachmentBytes, files: 1, fields: 4, fieldSize: 16 * 1024 },
}).single('file')

/**
 * Parses one multipart `file` in memory, turning multer's errors into answers that name the
 * field: too large → 413, anything else malformed → 400. The type is checked by the service.
 */
export const attachmentUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) return next()
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        const mb = COMMENT_LIMITS.attachmentBytes / 1024 / 1024
        return next(
          new HttpError(413, 'too_large', `file: must be at most ${mb} MB`, [
            { path: 'file', message: `must be at most ${mb} MB` },
          ]),
        )
      }
      const field = err.field ?? 'file'
      return next(badRequest(`${field}: ${err.message}`, [{ path: field, message: err.message }]))
    }
    next(
      badRequest('body: not a readable multipart form', [
        { path: 'body', message: 'not a readable multipart form' },
      ]),
    )
  })
}
