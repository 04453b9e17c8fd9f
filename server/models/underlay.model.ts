import { DataTypes, type Model, type ModelStatic, type Optional, type Sequelize } from 'sequelize';

/** An architectural plan image under one level of a scheme (migration 0005-underlays). */
export interface UnderlayAttributes {
  id: string;
  schemeId: string;
  /** The plan level's id inside the scheme's plan, e.g. "L2". */
  levelId: string;
  /** The name the file was uploaded with (display only; the bytes are stored under storageKey). */
  filename: string;
  /** From the file's content: image/png, image/jpeg or application/pdf. */
  mime: 'image/png' | 'image/jpeg' | 'application/pdf';
  bytes: number;
  /** Image pixels; for a PDF, the shown page's size in PDF points (1/72 in) at scale 1. */
  widthPx: number;
  heightPx: number;
  storageKey: string;
  /** PDF only (migration 0007): the page shown (1-based) and how many the document has. */
  pageNumber: number | null;
  pageCount: number | null;
  /** Locked: placement (calibration) cannot change until unlocked. */
  locked: boolean;
  /** Plan coordinates (ft) of the image's top-left pixel. */
  originXFt: number;
  originYFt: number;
  scaleFtPerPx: number;
  /** Counter-clockwise on the plan, about the top-left corner. */
  rotationDeg: number;
  opacity: number;
  visible: boolean;
  createdBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}
export type UnderlayCreation = Optional<
  UnderlayAttributes,
  'id' | 'originXFt' | 'originYFt' | 'rotationDeg' | 'opacity' | 'visible' | 'pageNumber' | 'pageCount' | 'locked' | 'createdAt' | 'updatedAt'
>;
export type UnderlayModel = ModelStatic<Model<UnderlayAttributes, UnderlayCreation>>;

export function defineUnderlayModel(sequelize: Sequelize): UnderlayModel {
  return sequelize.define<Model<UnderlayAttributes, UnderlayCreation>>(
    'Underlay',
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      schemeId: { type: DataTypes.UUID, allowNull: false },
      levelId: { type: DataTypes.STRING(255), allowNull: false },
      filename: { type: DataTypes.STRING(255), allowNull: false },
      mime: { type: DataTypes.STRING(50), allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      widthPx: { type: DataTypes.INTEGER, allowNull: false },
      heightPx: { type: DataTypes.INTEGER, allowNull: false },
      storageKey: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      pageNumber: { type: DataTypes.INTEGER, allowNull: true },
      pageCount: { type: DataTypes.INTEGER, allowNull: true },
      locked: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      originXFt: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      originYFt: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      scaleFtPerPx: { type: DataTypes.DOUBLE, allowNull: false },
      rotationDeg: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      opacity: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0.5 },
      visible: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdBy: { type: DataTypes.UUID, allowNull: true },
      createdAt: { type: DataTypes.DATE, allowNull: false },
      updatedAt: { type: DataTypes.DATE, allowNull: false },
    },
    { tableName: 'underlays', underscored: true },
  );
}
