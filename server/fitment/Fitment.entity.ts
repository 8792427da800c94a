import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { LeveragePointDto, LoadStationDto, SagEndDto, TorqueDto } from '../../shared/catalogue';
import { Bike } from './Bike.entity';

/** One bike variant over a year range, with everything the engine needs; quantities SI. */
@Entity({ name: 'fitments' })
export class Fitment {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'bike_id', type: 'uuid' })
  bikeId!: string;

  @ManyToOne(() => Bike, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'bike_id' })
  bike?: Relation<Bike>;

  @Column({ type: 'varchar', length: 60, default: '' })
  variant!: string;

  @Column({ name: 'year_from', type: 'int' })
  yearFrom!: number;

  @Column({ name: 'year_to', type: 'int' })
  yearTo!: number;

  @Column({ name: 'mass_input', type: 'varchar', length: 10 })
  massInput!: 'sprung' | 'wet';

  @Column({ name: 'front_sprung_mass_kg', type: 'double precision' })
  frontSprungMassKg!: number;

  @Column({ name: 'rear_sprung_mass_kg', type: 'double precision' })
  rearSprungMassKg!: number;

  @Column({ name: 'wet_mass_kg', type: 'double precision', nullable: true })
  wetMassKg!: number | null;

  @Column({ name: 'front_static_share_pct', type: 'double precision', nullable: true })
  frontStaticSharePct!: number | null;

  @Column({ name: 'front_unsprung_mass_kg', type: 'double precision', nullable: true })
  frontUnsprungMassKg!: number | null;

  @Column({ name: 'rear_unsprung_mass_kg', type: 'double precision', nullable: true })
  rearUnsprungMassKg!: number | null;

  @Column({ name: 'rated_load_kg', type: 'double precision' })
  ratedLoadKg!: number;

  @Column({ name: 'wheelbase_mm', type: 'double precision' })
  wheelbaseMm!: number;

  @Column({ name: 'load_stations', type: 'jsonb' })
  loadStations!: LoadStationDto[];

  @Column({ name: 'rear_leverage_ratio', type: 'double precision', nullable: true })
  rearLeverageRatio!: number | null;

  @Column({ name: 'rear_leverage_curve', type: 'jsonb', nullable: true })
  rearLeverageCurve!: LeveragePointDto[] | null;

  @Column({ name: 'rear_wheel_travel_mm', type: 'double precision' })
  rearWheelTravelMm!: number;

  @Column({ name: 'shock_stroke_mm', type: 'double precision' })
  shockStrokeMm!: number;

  @Column({ name: 'shock_count', type: 'int', default: 1 })
  shockCount!: number;

  @Column({ name: 'rear_preload_min_mm', type: 'double precision' })
  rearPreloadMinMm!: number;

  @Column({ name: 'rear_preload_max_mm', type: 'double precision' })
  rearPreloadMaxMm!: number;

  @Column({ name: 'rear_adjuster_pitch_mm', type: 'double precision' })
  rearAdjusterPitchMm!: number;

  @Column({ name: 'shock_spring_inner_diameter_mm', type: 'double precision' })
  shockSpringInnerDiameterMm!: number;

  @Column({ name: 'shock_spring_free_length_min_mm', type: 'double precision' })
  shockSpringFreeLengthMinMm!: number;

  @Column({ name: 'shock_spring_free_length_max_mm', type: 'double precision' })
  shockSpringFreeLengthMaxMm!: number;

  @Column({ name: 'fork_angle_deg', type: 'double precision' })
  forkAngleDeg!: number;

  @Column({ name: 'fork_travel_mm', type: 'double precision' })
  forkTravelMm!: number;

  @Column({ name: 'fork_spring_count', type: 'int' })
  forkSpringCount!: number;

  @Column({ name: 'fork_preload_min_mm', type: 'double precision' })
  forkPreloadMinMm!: number;

  @Column({ name: 'fork_preload_max_mm', type: 'double precision' })
  forkPreloadMaxMm!: number;

  @Column({ name: 'fork_adjuster_pitch_mm', type: 'double precision', nullable: true })
  forkAdjusterPitchMm!: number | null;

  @Column({ name: 'fork_stock_spacer_mm', type: 'double precision', nullable: true })
  forkStockSpacerMm!: number | null;

  @Column({ name: 'fork_stock_preload_mm', type: 'double precision' })
  forkStockPreloadMm!: number;

  @Column({ name: 'fork_spring_inner_diameter_mm', type: 'double precision' })
  forkSpringInnerDiameterMm!: number;

  @Column({ name: 'fork_spring_free_length_min_mm', type: 'double precision' })
  forkSpringFreeLengthMinMm!: number;

  @Column({ name: 'fork_spring_free_length_max_mm', type: 'double precision' })
  forkSpringFreeLengthMaxMm!: number;

  @Column({ type: 'jsonb' })
  sag!: { front: SagEndDto; rear: SagEndDto };

  @Column({ name: 'front_static_sag_tolerance_mm', type: 'double precision', default: 3 })
  frontStaticSagToleranceMm!: number;

  @Column({ name: 'rear_static_sag_tolerance_mm', type: 'double precision', default: 3 })
  rearStaticSagToleranceMm!: number;

  @Column({ name: 'stock_fork_rate_n_per_mm', type: 'double precision' })
  stockForkRateNPerMm!: number;

  @Column({ name: 'stock_fork_free_length_mm', type: 'double precision' })
  stockForkFreeLengthMm!: number;

  @Column({ name: 'stock_shock_rate_n_per_mm', type: 'double precision' })
  stockShockRateNPerMm!: number;

  @Column({ name: 'stock_shock_free_length_mm', type: 'double precision' })
  stockShockFreeLengthMm!: number;

  @Column({ type: 'jsonb' })
  torques!: TorqueDto[];

  @Column({ type: 'jsonb' })
  tools!: string[];

  @Column({ type: 'text', default: '' })
  notes!: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
