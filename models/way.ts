import { DataTypes, Model, type Sequelize } from 'sequelize';

import { LABEL_STATUSES, type LabelStatus } from '@/lib/domain';

export { LABEL_STATUSES, type LabelStatus };

/**
 * One device on the rail. `device` and `circuit` hold the engine's DeviceOnRail and
 * CircuitSpec shapes (lib/sizing), validated by the API before they are stored.
 */
export class Way extends Model {
  declare id: string;
  declare boardId: string;
  declare rail: number;
  declare position: number;
  declare device: Record<string, unknown>;
  declare circuit: Record<string, unknown> | null;
  declare labelStatus: LabelStatus;
  declare labelNote: string;
  declare labelCheckedById: string | null;
  declare labelCheckedAt: Date | null;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    Way.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        boardId: { type: DataTypes.UUID, allowNull: false },
        rail: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 },
        position: { type: DataTypes.INTEGER, allowNull: false },
        device: { type: DataTypes.JSONB, allowNull: false },
        circuit: { type: DataTypes.JSONB, allowNull: true },
        labelStatus: {
          type: DataTypes.ENUM(...LABEL_STATUSES),
          allowNull: false,
          defaultValue: 'unchecked',
        },
        labelNote: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        labelCheckedById: { type: DataTypes.UUID, allowNull: true },
        labelCheckedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'ways', underscored: true },
    );
  }
}
