import { DataTypes, Model, type Sequelize } from 'sequelize';

import type { BoardRow } from '@/lib/boards/schemas';
import { BOARD_STATUSES, type BoardStatus } from '@/lib/domain';

export { BOARD_STATUSES, type BoardStatus };

/** A boards row: its attributes are typed by the board's schema module (`BoardRow`). */
// eslint-disable-next-line @typescript-eslint/no-empty-object-type, @typescript-eslint/no-unsafe-declaration-merging
export interface Board extends BoardRow {}
// eslint-disable-next-line @typescript-eslint/no-unsafe-declaration-merging
export class Board extends Model {
  static setup(sequelize: Sequelize): void {
    Board.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        location: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        phases: { type: DataTypes.SMALLINT, allowNull: false },
        supply: { type: DataTypes.JSONB, allowNull: false },
        incoming: { type: DataTypes.JSONB, allowNull: false },
        enclosureModules: { type: DataTypes.SMALLINT, allowNull: false },
        rails: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 },
        dwelling: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        conditionalRatingKa: { type: DataTypes.DOUBLE, allowNull: true },
        status: { type: DataTypes.ENUM(...BOARD_STATUSES), allowNull: false, defaultValue: 'draft' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        createdById: { type: DataTypes.UUID, allowNull: true },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        archivedById: { type: DataTypes.UUID, allowNull: true },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        deletedById: { type: DataTypes.UUID, allowNull: true },
        designChangedById: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'boards', underscored: true },
    );
  }
}
