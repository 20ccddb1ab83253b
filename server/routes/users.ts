import { Router } from 'express';
import { CreateUserRequest, IdParam, UpdateUserRequest } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { allow, currentUser } from '../middleware/auth';
import { allUsers, changeUser, createUser, signOutEverywhere } from '../services/userService';

export function userRoutes(ctx: AppContext): Router {
  return Router()
    .use('/users', allow('admin'))
    .get('/users', async (_req, res) => {
      res.json({ items: await allUsers(ctx) });
    })
    .post('/users', async (req, res) => {
      res.status(201).json({ user: await createUser(ctx, CreateUserRequest.parse(req.body)) });
    })
    .patch('/users/:id', async (req, res) => {
      const { id } = IdParam.parse(req.params);
      res.json({ user: await changeUser(ctx, currentUser(req).id, id, UpdateUserRequest.parse(req.body)) });
    })
    .delete('/users/:id/sessions', async (req, res) => {
      await signOutEverywhere(ctx, IdParam.parse(req.params).id);
      res.status(204).end();
    });
}
