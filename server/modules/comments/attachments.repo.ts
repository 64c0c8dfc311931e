import type { Db } from '../../db/knex.ts'

export const insertAttachment = (
  db: Db,
  row: {
    comment_id: string
    project_id: string
    file_name: string
    mime_type: string
    size_bytes: number
    data: Buffer
  },
) => db('comment_attachments').insert(row)

export const findAttachment = (db: Db, projectId: string, id: string) =>
  db('comment_attachments')
    .where({ id, project_id: projectId })
    .first<{ file_name: string; mime_type: string; data: Buffer } | undefined>(
      'file_name',
      'mime_type',
      'data',
    )
