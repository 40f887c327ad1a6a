import { DataTypes, Model, type Sequelize } from 'sequelize';

/** Who did what, when. Append-only: the database refuses updates and deletes. */
export class AuditEvent extends Model {
  declare id: string;
  declare organisationId: string;
  declare boardId: string | null;
  declare userId: string | null;
  declare action: string;
  declare details: Record<string, unknown>;
  declare createdAt: Date;

  static setup(sequelize: Sequelize): void {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        boardId: { type: DataTypes.UUID, allowNull: true },
        userId: { type: DataTypes.UUID, allowNull: true },
        action: { type: DataTypes.STRING(60), allowNull: false },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'audit_events', underscored: true, updatedAt: false },
    );
  }
}
