import { Router } from 'express';
import { AddMemberRequest, MemberParams } from '../../shared/schemas/projectMember';
import { IdParam } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { addMember, memberCandidates, projectMembers, removeMember } from '../services/projectMemberService';

/**
 * Who is in a project. Behind projectScopes like every /projects/:id route: 404 for a project hidden
 * from the user. Changing members: engineers and admins by role, and of those only the project's
 * creator or an admin (checked by the service).
 */
export function projectMemberRoutes(ctx: AppContext): Router {
  return Router()
    .get('/projects/:id/members', async (req, res) => {
      res.json({ items: await projectMembers(ctx, IdParam.parse(req.params).id) });
    })
    .get('/projects/:id/member-candidates', allow('admin', 'engineer'), async (req, res) => {
      res.json({ items: await memberCandidates(ctx, currentUser(req), IdParam.parse(req.params).id) });
    })
    .post('/projects/:id/members', allow('admin', 'engineer'), async (req, res) => {
      const { member, created } = await addMember(ctx, currentUser(req), IdParam.parse(req.params).id, AddMemberRequest.parse(req.body));
      res.status(created ? 201 : 200).json({ member });
    })
    .delete('/projects/:id/members/:userId', allow('admin', 'engineer'), async (req, res) => {
      const { id, userId } = MemberParams.parse(req.params);
      await removeMember(ctx, currentUser(req), id, userId);
      res.status(204).end();
    });
}
