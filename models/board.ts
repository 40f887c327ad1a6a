import { DataTypes, Model, type Sequelize } from 'sequelize';

import { BOARD_STATUSES, type BoardStatus } from '@/lib/domain';

export { BOARD_STATUSES, type BoardStatus };

export type SupplyData = {
  earthing: 'TN-S' | 'TN-C-S' | 'TT';
  uoV: number;
  zeOhm: number;
  pfcKa: number;
  source: 'public' | 'private';
};

export type IncomingDevice = {
  kind: 'main-switch' | 'mcb' | 'fuse-bs88-2' | 'rcd';
  ratingA: number;
  busbarRatingA?: number;
};

export class Board extends Model {
  declare id: string;
  declare organisationId: string;
  declare siteId: string;
  declare name: string;
  declare location: string;
  declare phases: 1 | 3;
  declare supply: SupplyData;
  declare incoming: IncomingDevice;
  declare enclosureModules: number;
  declare rails: number;
  declare dwelling: boolean;
  /** Rated conditional short-circuit current of the assembly, kA (BS EN 61439-3), or null. */
  declare conditionalRatingKa: number | null;
  declare status: BoardStatus;
  /** Bumped on every save; a save naming an older version is refused (optimistic locking). */
  declare version: number;
  /** The revision being drafted or last issued; issued revisions are frozen in board_revisions. */
  declare revision: number;
  declare createdById: string | null;
  /** Archived boards leave the lists but stay readable; an admin may restore them. */
  declare archivedAt: Date | null;
  declare archivedById: string | null;
  /** A never-issued board deleted by a designer: gone from every view, kept for undo. */
  declare deletedAt: Date | null;
  declare deletedById: string | null;
  /** Who last changed the design (created or saved it): they may not issue it themselves. */
  declare designChangedById: string | null;
  declare createdAt: Date;
  declare updatedAt: Date;

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
