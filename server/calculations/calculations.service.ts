import type { ForkSpringRequestDto, RearSpringRequestDto, SagCheckRequestDto, SpringGeometryRequestDto } from '../../shared/dto/calculations.dto';
import { checkSag, computeForkSpring, computeRearSpring, computeSpringGeometry, EngineInputError, roundAnswer } from '../../shared/engine';
import { AppError } from '../errors';

// The DTOs have already been validated; an engine RangeError means inputs that pass field checks but not physics.
// Answers are rounded here, at the edge, so people read 17.9 rather than 17.899999999999977.
function guarded<T>(compute: () => T): T {
  try {
    return roundAnswer(compute());
  } catch (e) {
    if (e instanceof EngineInputError) throw AppError.validation(e.message, { [e.field]: e.message });
    if (e instanceof RangeError) throw AppError.validation(e.message, { body: e.message });
    throw e;
  }
}

export const rearSpring = (dto: RearSpringRequestDto) => guarded(() => computeRearSpring(dto));
export const forkSpring = (dto: ForkSpringRequestDto) => guarded(() => computeForkSpring(dto));
export const springGeometry = (dto: SpringGeometryRequestDto) => guarded(() => computeSpringGeometry(dto));
export const sagCheck = (dto: SagCheckRequestDto) => guarded(() => checkSag(dto));
