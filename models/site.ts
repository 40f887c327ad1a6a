import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Site extends Model {
  declare id: string;
  declare organisationId: string;
  declare name: string;
  declare address: string;
  declare client: string;
  /** Archived sites (and their boards) leave the lists but stay readable; an admin may restore them. */
  declare archivedAt: Date | null;
  declare archivedById: string | null;
  declare createdAt: Date;
  declare updatedAt: Date;

  static setup(sequelize: Sequelize): void {
    Site.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        address: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        client: { type: DataTypes.STRING(160), allowNull: false, defaultValue: '' },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        archivedById: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'sites', underscored: true },
    );
  }
}
