import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { currentUser, requireRole } from '../middleware/auth';
import type { ObjectStorage } from '../services/storage/object-storage';
import { readTeamData, writeTeamArchive } from '../services/team-archive/team-export';

/** What the team export needs from the app. */
export interface TeamExportDeps {
  readonly sequelize: Sequelize;
  readonly storage: ObjectStorage;
}

/** GET /api/team/export: every row and file of the admin's team as one .tar.gz (admins only). */
export function createTeamExportRouter({ sequelize, storage }: TeamExportDeps): Router {
  const router = Router();

  router.get('/export', requireRole('admin'), async (req, res) => {
    const admin = currentUser(req);
    // The rows are read before the first byte goes out, so a database error is still a JSON answer.
    const data = await readTeamData(sequelize, admin.teamId);
    const day = new Date().toISOString().slice(0, 10);
    res.setHeader('Cache-Control', 'no-store');
    res.attachment(`slantwise-team-${admin.teamId}-${day}.tar.gz`);
    res.type('application/gzip');
    try {
      await writeTeamArchive(data, storage, res);
    } catch (err) {
      // Headers are gone: cut the download short, so the client sees a broken (never a silently partial) archive.
      console.error(`[error] team export of team ${admin.teamId} failed:`, err);
      res.destroy(err instanceof Error ? err : undefined);
    }
  });

  return router;
}
