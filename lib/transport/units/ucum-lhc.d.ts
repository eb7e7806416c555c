// Minimal typings for the parts of @lhncbc/ucum-lhc we call (the package ships none).
declare module '@lhncbc/ucum-lhc' {
  export interface UcumValidation {
    status: 'valid' | 'invalid' | 'error';
    ucumCode: string | null;
    unit?: { code: string; name: string; guidance: string };
    msg: string[];
  }
  export interface UcumConversion {
    status: 'succeeded' | 'failed' | 'error';
    toVal: number | null;
    msg: string[];
  }
  export interface UcumBaseUnits {
    status: 'succeeded' | 'invalid' | 'failed' | 'error';
    msg: string[];
    magnitude?: number;
    unitToExp?: Record<string, number>;
    fromUnitIsSpecial?: boolean;
  }
  export class UcumLhcUtils {
    static getInstance(): UcumLhcUtils;
    validateUnitString(unit: string, suggest?: boolean, valConv?: 'validate' | 'convert'): UcumValidation;
    convertUnitTo(fromUnit: string, fromVal: number, toUnit: string): UcumConversion;
    convertToBaseUnits(fromUnit: string, fromVal: number): UcumBaseUnits;
  }
}
