/**
 * The vehicle's own parts on the vehicle screen (body parts, own ground fields, test cylinders)
 * and a mirror's served-fields chooser, on the demo school bus (server/seeders/demo-vehicles.ts).
 */
import '@testing-library/jest-dom';
import { act, fireEvent, render, screen } from '@testing-library/react';
import { ServedFieldsChooser } from '@/components/vehicle/served-fields-chooser';
import { VEHICLE_SAVE_AFTER_MS } from '@/components/vehicle/use-vehicle-draft';
import { VehiclePartsEditor } from '@/components/vehicle/vehicle-parts-editor';
import { vehicleViewOf } from '@/hooks/use-vehicle-evaluation';
import { evaluateVehicleJob } from '@/shared/project-optics';
import { vehicle as vehicleSchema, type Vehicle } from '@/shared/schemas/vehicle';
import { DEMO_SCHOOL_BUS } from '../../server/seeders/demo-vehicles';
import { demoCatalogueDtos, demoVehiclePlacementDtos } from './fixtures';

function busEvaluation() {
  const scene = DEMO_SCHOOL_BUS.scene;
  const placements = demoVehiclePlacementDtos(DEMO_SCHOOL_BUS, 0, 200);
  const ev = vehicleViewOf(scene, { ...evaluateVehicleJob({ scene, placements, catalogue: demoCatalogueDtos() }), zones: [] });
  if (!ev) throw new Error('the demo bus has a vehicle');
  return ev;
}

function renderParts(onSaveVehicle: (v: Vehicle) => void = jest.fn()) {
  const evaluation = busEvaluation();
  render(
    <VehiclePartsEditor
      evaluation={evaluation}
      canEdit
      units="metric"
      onSaveVehicle={onSaveVehicle}
      onSwitchDriveSide={jest.fn()}
      placing={null}
      onPlacing={jest.fn()}
    />,
  );
  return evaluation;
}

beforeEach(() => jest.useFakeTimers());
afterEach(() => jest.useRealTimers());

describe('the vehicle’s own parts on the vehicle screen', () => {
  it('says the schema’s sentence beside a body part taller than the schema allows, and saves nothing', () => {
    const save = jest.fn();
    renderParts(save);
    fireEvent.change(screen.getByTestId('vehicle-part-bodyBoxes.1.heightM'), { target: { value: '7' } });
    act(() => jest.advanceTimersByTime(VEHICLE_SAVE_AFTER_MS * 2));
    expect(screen.getByText('The body part’s height must be at most 6 m.')).toBeInTheDocument();
    expect(save).not.toHaveBeenCalled();
  });

  it('saves a body part’s new height a moment after the last keystroke', () => {
    const save = jest.fn();
    renderParts(save);
    fireEvent.change(screen.getByTestId('vehicle-part-bodyBoxes.1.heightM'), { target: { value: '3.2' } });
    expect(save).not.toHaveBeenCalled();
    act(() => jest.advanceTimersByTime(VEHICLE_SAVE_AFTER_MS + 10));
    expect(save).toHaveBeenCalledTimes(1);
    expect(save.mock.calls[0][0].bodyBoxes[1].heightM).toBeCloseTo(3.2, 9);
  });

  it('adds a test cylinder with an id of its own that the vehicle schema accepts', () => {
    const save = jest.fn();
    const before = renderParts(save).vehicle;
    fireEvent.click(screen.getByTestId('vehicle-cylinder-add'));
    const saved: Vehicle = save.mock.calls[0][0];
    expect(saved.targets).toHaveLength(before.targets.length + 1);
    expect(vehicleSchema.safeParse(saved).success).toBe(true);
  });

  it('removes a test cylinder by its own button', () => {
    const save = jest.fn();
    renderParts(save);
    fireEvent.click(screen.getByTestId('vehicle-cylinder-remove-cyl-d'));
    expect(save.mock.calls[0][0].targets.map((t: { id: string }) => t.id)).not.toContain('cyl-d');
  });

  it('says which cylinders the mirrors show, as the evaluation found', () => {
    const ev = renderParts();
    const d = ev.score?.targets.find((t) => t.targetId === 'cyl-d');
    // The demo bus's note: cylinder D beside the right front wheel is not seen yet.
    expect(d?.visible).toBe(false);
    expect(screen.getByTestId('vehicle-cylinder-seen-cyl-d')).toHaveTextContent('Not seen');
  });

  it('adds an own ground field and shows its share against the share it needs', () => {
    const save = jest.fn();
    renderParts(save);
    fireEvent.click(screen.getByTestId('vehicle-own-field-add'));
    const saved: Vehicle = save.mock.calls[0][0];
    expect(saved.groundFields).toHaveLength(1);
    expect(vehicleSchema.safeParse(saved).success).toBe(true);
    expect(screen.getByTestId(`vehicle-own-field-${saved.groundFields[0].id}`)).toHaveTextContent('Own field 1');
  });
});

describe('which fields a mirror serves', () => {
  const fields = [
    { id: 'un-ii-left', name: 'Main rear view, left' },
    { id: 'un-v-left', name: 'Close proximity, left' },
    { id: 'un-vi', name: 'Front' },
  ];

  it('turns "every field" into a list of all of them, ready to untick', () => {
    const onChange = jest.fn();
    render(<ServedFieldsChooser fields={fields} value={null} onChange={onChange} />);
    fireEvent.click(screen.getByTestId('vehicle-serves-list'));
    expect(onChange).toHaveBeenCalledWith(['un-ii-left', 'un-v-left', 'un-vi']);
  });

  it('unticks one field and keeps the others in the fields’ order', () => {
    const onChange = jest.fn();
    render(<ServedFieldsChooser fields={fields} value={['un-vi', 'un-ii-left', 'un-v-left']} onChange={onChange} />);
    fireEvent.click(screen.getByTestId('vehicle-serves-un-v-left'));
    expect(onChange).toHaveBeenCalledWith(['un-ii-left', 'un-vi']);
  });

  it('saves null when the installer goes back to every field', () => {
    const onChange = jest.fn();
    render(<ServedFieldsChooser fields={fields} value={['un-vi']} onChange={onChange} />);
    fireEvent.click(screen.getByTestId('vehicle-serves-all'));
    expect(onChange).toHaveBeenCalledWith(null);
  });
});
