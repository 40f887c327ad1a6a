import { DataTypes, Model, type Sequelize } from 'sequelize';

/** A photo of the built board or of one way, kept in object storage under `storageKey`. */
export class Attachment extends Model {
  declare id: string;
  declare organisationId: string;
  declare boardId: string;
  declare wayId: string | null;
  declare storageKey: string;
  declare thumbKey: string | null;
  declare contentType: string;
  declare sizeBytes: number;
  declare fileName: string;
  declare uploadedById: string;
  declare createdAt: Date;
  /** A photo removed from a board that was issued: hidden from the board, kept in storage. */
  declare withdrawnAt: Date | null;
  declare withdrawnById: string | null;

  static setup(sequelize: Sequelize): void {
    Attachment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        boardId: { type: DataTypes.UUID, allowNull: false },
        wayId: { type: DataTypes.UUID, allowNull: true },
        storageKey: { type: DataTypes.STRING(300), allowNull: false },
        thumbKey: { type: DataTypes.STRING(300), allowNull: true },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        fileName: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        uploadedById: { type: DataTypes.UUID, allowNull: false },
        withdrawnAt: { type: DataTypes.DATE, allowNull: true },
        withdrawnById: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'attachments', underscored: true, updatedAt: false },
    );
  }
}
