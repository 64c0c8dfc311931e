import { Router } from 'express'
import {
  addOrganisationMemberBodySchema,
  changeOrganisationRoleBodySchema,
  createOrganisationBodySchema,
} from '../../../shared/api/organisations.ts'
import type { Db } from '../../db/knex.ts'
import { forbidden } from '../../errors.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import { requireOrganisationRole } from './require-organisation-role.ts'
import * as organisations from './organisations.service.ts'

/** Mounted at /api/organisations. Members read; admins manage members (anyone may leave). */
export function organisationsRouter(db: Db): Router {
  const router = Router()
  router.use(requireUser)
  const member = requireOrganisationRole(db, 'member')
  const admin = requireOrganisationRole(db, 'admin')
  const ids = (req: { params: Record<string, string | string[] | undefined> }) => ({
    organisationId: String(req.params.organisationId),
    memberId: String(req.params.userId),
  })

  router.get('/', async (req, res) => {
    res.json({ organisations: await organisations.listOrganisations(db, userId(req)) })
  })

  router.post('/', validateBody(createOrganisationBodySchema), async (req, res) => {
    const org = await db.transaction((trx) =>
      organisations.createOrganisation(trx, userId(req), req.body.name),
    )
    res
      .status(201)
      .json({ organisation: await organisations.getOrganisation(db, org.id, userId(req)) })
  })

  router.get('/:organisationId', member, async (req, res) => {
    res.json({
      organisation: await organisations.getOrganisation(db, ids(req).organisationId, userId(req)),
    })
  })

  router.get('/:organisationId/members', member, async (req, res) => {
    res.json({ members: await organisations.listMembers(db, ids(req).organisationId) })
  })

  router.post(
    '/:organisationId/members',
    admin,
    validateBody(addOrganisationMemberBodySchema),
    async (req, res) => {
      const { organisationId } = ids(req)
      res
        .status(201)
        .json({ member: await organisations.addMember(db, userId(req), organisationId, req.body) })
    },
  )

  router.patch(
    '/:organisationId/members/:userId',
    admin,
    validateBody(changeOrganisationRoleBodySchema),
    async (req, res) => {
      const { organisationId, memberId } = ids(req)
      res.json({
        member: await organisations.changeRole(
          db,
          userId(req),
          organisationId,
          memberId,
          req.body.role,
        ),
      })
    },
  )

  // Admins remove anyone; a member may only remove themselves (leave).
  router.delete('/:organisationId/members/:userId', member, async (req, res) => {
    const { organisationId, memberId } = ids(req)
    if (req.organisationRole !== 'admin' && memberId !== userId(req)) {
      throw forbidden('Only organisation admins may remove other members')
    }
    await organisations.removeMember(db, userId(req), organisationId, memberId)
    res.status(204).end()
  })

  return router
}
