import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Organisation extends Model {
  declare id: string;
  declare name: string;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    Organisation.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
      },
      { sequelize, tableName: 'organisations', underscored: true },
    );
  }
}
