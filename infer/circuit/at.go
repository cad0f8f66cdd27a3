package circuit

// At returns the rectifier at corner c: the secondary EMF multiplied by
// c.Mains, the filter capacitance by c.CapFactor (a zero factor leaves it
// unchanged) and c.Load as the load. It is the one place a corner is applied
// to a rectifier.
func (r Rectifier) At(c Corner) Rectifier {
	if c.Mains > 0 {
		r.VrmsV *= c.Mains
	}
	if c.CapFactor > 0 {
		r.CapF *= c.CapFactor
	}
	r.Load = c.Load
	return r
}
