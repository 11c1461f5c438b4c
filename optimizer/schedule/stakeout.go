package schedule

import (
	"encoding/csv"
	"encoding/json"
	"io"
	"strconv"
)

// WriteStakeoutCSV writes the stakeout list: one row per point, by the day
// its rig reaches it.
func WriteStakeoutCSV(w io.Writer, s *Schedule) error {
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"id", "rig", "seq", "method", "x_ft", "y_ft", "lon", "lat", "depth_ft", "sample_interval_ft", "sampling", "date", "work_day"}); err != nil {
		return err
	}
	for _, k := range s.Stakes {
		lon, lat := "", ""
		if k.Lon != nil {
			lon, lat = num(*k.Lon, 7), num(*k.Lat, 7)
		}
		if err := cw.Write([]string{k.ID, k.Rig, strconv.Itoa(k.Seq), k.Method, num(k.XFt, 2), num(k.YFt, 2), lon, lat,
			num(k.DepthFt, 1), num(k.SampleIntervalFt, 1), k.Sampling, k.Date.Format(dateLayout), strconv.Itoa(k.WorkDay)}); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// WriteStakeoutGeoJSON writes the stakeout list as an RFC 7946
// FeatureCollection of Points. RFC 7946 §4 fixes the coordinate reference
// system to WGS 84 longitude, latitude, so every point needs lon/lat; a
// schedule made from plan coordinates alone is refused with an error saying
// an origin is needed. Positions carry 7 decimals (about 1 cm; RFC 7946
// §11.2 notes 6 are about 10 cm).
func WriteStakeoutGeoJSON(w io.Writer, s *Schedule) error {
	type geometry struct {
		Type        string         `json:"type"`
		Coordinates [2]json.Number `json:"coordinates"`
	}
	type props struct {
		ID               string  `json:"id"`
		Name             string  `json:"name"` // the ID again: the field GIS programs label points by
		Rig              string  `json:"rig"`
		Seq              int     `json:"seq"`
		Method           string  `json:"method"`
		XFt              float64 `json:"x_ft"`
		YFt              float64 `json:"y_ft"`
		DepthFt          float64 `json:"depth_ft"`
		SampleIntervalFt float64 `json:"sample_interval_ft"`
		Sampling         string  `json:"sampling,omitempty"`
		Date             string  `json:"date"`
		WorkDay          int     `json:"work_day"`
	}
	type feature struct {
		Type       string   `json:"type"`
		ID         string   `json:"id"`
		Geometry   geometry `json:"geometry"`
		Properties props    `json:"properties"`
	}
	fc := struct {
		Type     string    `json:"type"`
		Features []feature `json:"features"`
	}{Type: "FeatureCollection", Features: []feature{}}
	for _, k := range s.Stakes {
		if k.Lon == nil || k.Lat == nil {
			return bad("stakeout GeoJSON", "point %q has plan coordinates (x_ft, y_ft) but no lon/lat",
				"give the site an origin (the lon/lat of x = 0, y = 0) so points can be placed in WGS 84, or write the stakeout CSV instead", k.ID)
		}
		fc.Features = append(fc.Features, feature{
			Type: "Feature", ID: k.ID,
			Geometry: geometry{Type: "Point", Coordinates: [2]json.Number{json.Number(num(*k.Lon, 7)), json.Number(num(*k.Lat, 7))}},
			Properties: props{ID: k.ID, Name: k.ID, Rig: k.Rig, Seq: k.Seq, Method: k.Method, XFt: k.XFt, YFt: k.YFt,
				DepthFt: k.DepthFt, SampleIntervalFt: k.SampleIntervalFt, Sampling: k.Sampling, Date: k.Date.Format(dateLayout), WorkDay: k.WorkDay},
		})
	}
	b, err := json.MarshalIndent(fc, "", "  ")
	if err != nil {
		return err
	}
	_, err = w.Write(append(b, '\n'))
	return err
}
