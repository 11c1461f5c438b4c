package schedule

import "time"

// testCalendar is a Monday start, 07:00, 10-hour days, Monday to Friday
// (common practice for a drilling crew's day).
func testCalendar() Calendar {
	return Calendar{Start: time.Date(2027, 3, 1, 0, 0, 0, 0, time.UTC), WorkStart: 7 * time.Hour, HoursPerDay: 10}
}
