import type { Sequelize } from 'sequelize';

// The models register on the process's one pool; lib/db.ts holds only that pool (it imports lib/env alone)
// eslint-disable-next-line import/no-restricted-paths
import { db } from '@/lib/db';

import { Attachment } from './attachment';
import { AuditEvent } from './audit-event';
import { Board } from './board';
import { BoardRevision } from './board-revision';
import { Comment } from './comment';
import { Invitation } from './invitation';
import { Organisation } from './organisation';
import { OutgoingMail } from './outgoing-mail';
import { Site } from './site';
import { User } from './user';
import { Way } from './way';

export {
  Attachment,
  AuditEvent,
  Board,
  BoardRevision,
  Comment,
  Invitation,
  Organisation,
  OutgoingMail,
  Site,
  User,
  Way,
};

/**
 * Registers every model and its associations on one connection. Importing this module does it
 * on the process's pool (Next bundles server code per layer, each with its own copy of the
 * model classes: each copy registers itself when its bundle imports it).
 */
export function setupModels(sequelize: Sequelize): void {
  for (const model of [
    Organisation,
    User,
    Invitation,
    Site,
    Board,
    Way,
    BoardRevision,
    Comment,
    Attachment,
    AuditEvent,
    OutgoingMail,
  ]) {
    model.setup(sequelize);
  }
  Site.hasMany(Board, { foreignKey: 'siteId', as: 'boards' });
  Board.belongsTo(Site, { foreignKey: 'siteId', as: 'site' });
  Board.hasMany(Way, { foreignKey: 'boardId', as: 'ways' });
  Way.belongsTo(Board, { foreignKey: 'boardId' });
  Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  BoardRevision.belongsTo(User, { foreignKey: 'issuedById', as: 'issuedBy' });
}

setupModels(db());
