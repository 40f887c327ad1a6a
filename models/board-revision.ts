import { DataTypes, Model, type Sequelize } from 'sequelize';

/** A frozen copy of a board and its sizing, made when an inspector issues it. */
export class BoardRevision extends Model {
  declare id: string;
  declare boardId: string;
  declare revision: number;
  declare snapshot: Record<string, unknown>;
  declare sizing: Record<string, unknown>;
  declare issuedById: string;
  declare issuedAt: Date;
  /** The issuer's name as they typed it to confirm the issue (null before declarations were asked). */
  declare declaration: string | null;

  static setup(sequelize: Sequelize): void {
    BoardRevision.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        boardId: { type: DataTypes.UUID, allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        snapshot: { type: DataTypes.JSONB, allowNull: false },
        sizing: { type: DataTypes.JSONB, allowNull: false },
        issuedById: { type: DataTypes.UUID, allowNull: false },
        issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        declaration: { type: DataTypes.STRING(160), allowNull: true },
      },
      { sequelize, tableName: 'board_revisions', underscored: true, timestamps: false },
    );
  }
}
