import { Router } from 'express';
import {
  coreOhmsPerMetre,
  longestRunMetres,
  runLoopOhms,
  voltageAtDetector,
  type CoreBuild,
} from '../calc/cable';
import { systemGrade } from '../calc/grade';
import { classifyReading, loopBands } from '../calc/loop';
import { formatOhms, toRkm } from '../calc/notation';
import { powerBudget, standbyHours } from '../calc/power';
import { colourBands, isPreferred, nearestPreferred } from '../calc/preferred-values';
import { ValidationError } from '../http/errors';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { CABLE_BUILDS } from '../engineering/site-engineering';
import {
  cableQuerySchema,
  gradeQuerySchema,
  loopQuerySchema,
  powerQuerySchema,
  resistanceQuerySchema,
} from './schema';

function buildOf(cable: { core?: '7/0.2' | '16/0.2'; areaMm2?: number }): CoreBuild {
  return cable.core ? CABLE_BUILDS[cable.core] : { areaMm2: cable.areaMm2! };
}

/** Bands, with the open band's upper edge written as null (JSON has no infinity). */
const finite = (value: number) => (Number.isFinite(value) ? value : null);

function safeColours(ohms: number, count: 4 | 5) {
  try {
    return colourBands(ohms, count).bands;
  } catch {
    return null;
  }
}

/** The engineers' calculators: every calculation Wardbook makes, on numbers typed in. */
export function createCalculatorsRouter(): Router {
  const router = Router();
  const staff = requireRole('engineer', 'office');

  router.post('/api/calc/resistance', staff, function resistance(req, res) {
    const { value } = parseRequest(resistanceQuerySchema, req.body, 'body');
    res.json({
      ohms: value,
      code: toRkm(value),
      spoken: formatOhms(value),
      e12: { nearest: nearestPreferred(value, 'E12'), isPreferred: isPreferred(value, 'E12') },
      e24: { nearest: nearestPreferred(value, 'E24'), isPreferred: isPreferred(value, 'E24') },
      fourBands: safeColours(value, 4),
      fiveBands: safeColours(value, 5),
    });
  });

  router.post('/api/calc/loop', staff, function loop(req, res) {
    const input = parseRequest(loopQuerySchema, req.body, 'body');
    const cableOhms = input.cable
      ? (() => {
          const ohms = runLoopOhms(
            input.cable.runMetres,
            coreOhmsPerMetre(buildOf(input.cable), input.cable.temperatureC),
            input.cable.coresPerLeg,
          );
          return { min: ohms, max: ohms };
        })()
      : { min: 0, max: 0 };
    const design = {
      wiring: input.wiring,
      tamperOhms: input.tamperOhms,
      alarmOhms: input.alarmOhms,
      tolerance: input.tolerance,
      cableOhms,
    };
    const { bands, problems } = loopBands(design);
    if (bands.length === 0) {
      throw new ValidationError(
        problems.map((message) => ({
          path: message.includes('alarm') ? 'body.alarmOhms' : 'body.tamperOhms',
          message,
        })),
      );
    }
    const classification = input.reading === null ? null : classifyReading(design, input.reading);
    res.json({
      cableOhms: cableOhms.max,
      bands: bands.map((band) => ({
        ...band,
        nominalOhms: finite(band.nominalOhms),
        highOhms: finite(band.highOhms),
      })),
      problems,
      classification: classification && {
        state: classification.state,
        band: classification.band.state,
        marginOhms:
          classification.marginOhms === Number.POSITIVE_INFINITY ? null : classification.marginOhms,
      },
    });
  });

  router.post('/api/calc/cable', staff, function cable(req, res) {
    const input = parseRequest(cableQuerySchema, req.body, 'body');
    const ohmsPerMetre = coreOhmsPerMetre(buildOf(input), input.temperatureC);
    const currentAmps = input.currentMa / 1000;
    res.json({
      ohmsPerMetre,
      loopOhms: runLoopOhms(input.runMetres, ohmsPerMetre, input.coresPerLeg),
      voltsAtDetector: voltageAtDetector({
        supplyVolts: input.supplyVolts,
        currentAmps,
        runMetres: input.runMetres,
        ohmsPerMetre,
        coresPerLeg: input.coresPerLeg,
      }),
      longestRunMetres: finite(
        longestRunMetres({
          supplyVolts: input.supplyVolts,
          minimumVolts: input.minimumVolts,
          currentAmps,
          ohmsPerMetre,
          coresPerLeg: input.coresPerLeg,
        }),
      ),
    });
  });

  router.post('/api/calc/power-budget', staff, function power(req, res) {
    const input = parseRequest(powerQuerySchema, req.body, 'body');
    const lookedUp = standbyHours(input);
    const hours = input.standbyHoursOverride ?? lookedUp.hours;
    if (hours === null) {
      throw new ValidationError([
        {
          path: 'body.standbyHoursOverride',
          message: 'reason' in lookedUp ? lookedUp.reason : 'Enter the standby time.',
        },
      ]);
    }
    res.json({
      standbySource:
        input.standbyHoursOverride !== null
          ? 'entered'
          : 'source' in lookedUp
            ? lookedUp.source
            : '',
      ...powerBudget({
        items: input.items,
        standbyHours: hours,
        alarmMinutes: input.alarmMinutes,
        batteryAh: input.batteryAh,
      }),
    });
  });

  router.post('/api/calc/grade', staff, function grade(req, res) {
    const { components } = parseRequest(gradeQuerySchema, req.body, 'body');
    res.json(systemGrade(components));
  });

  return router;
}
