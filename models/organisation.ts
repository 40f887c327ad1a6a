import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Organisation extends Model {
  declare id: string;
  declare name: string;
  /** One-person firms: the person who last changed a design may issue it too (off by default). */
  declare allowSelfIssue: boolean;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    Organisation.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        allowSelfIssue: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      },
      { sequelize, tableName: 'organisations', underscored: true },
    );
  }
}
