// The lab's stock as the API returns it and as the import plan reads it.
import type { Compliance } from "@/lib/validation/stock";

export type BalloonView = { id: number; diameterMm: number; inStock: boolean };

export type FamilyValues = {
  name: string;
  compliance: Compliance;
  nominalAtm: number;
  rbpAtm: number;
  growthAtRbpMm: number | null;
};

export type BalloonFamilyView = FamilyValues & { id: number; balloons: BalloonView[] };

export type StentSizeView = { id: number; nominalMm: number; maxPostDilatationMm: number };
export type StentPlatformView = { id: number; name: string; sizes: StentSizeView[] };

export type StockView = {
  revision: number;
  balloonFamilies: BalloonFamilyView[];
  stentPlatforms: StentPlatformView[];
};
