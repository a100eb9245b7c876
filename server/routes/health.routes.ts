import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { checkHealth } from '../services/health.service';

export function healthRoutes(sequelize: Sequelize, version: string): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const { httpStatus, body } = await checkHealth(() => sequelize.query('SELECT 1'), version);
    res.status(httpStatus).set('Cache-Control', 'no-store').json(body);
  });
  return router;
}
