import { DataTypes, Model, type Sequelize } from 'sequelize';

import type { WayRow } from '@/lib/boards/schemas';
import { LABEL_STATUSES, type LabelStatus } from '@/lib/domain';

export { LABEL_STATUSES, type LabelStatus };

/** One device on the rail: its attributes are typed by the board's schema module (`WayRow`). */
// eslint-disable-next-line @typescript-eslint/no-empty-object-type, @typescript-eslint/no-unsafe-declaration-merging
export interface Way extends WayRow {}
// eslint-disable-next-line @typescript-eslint/no-unsafe-declaration-merging
export class Way extends Model {
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
